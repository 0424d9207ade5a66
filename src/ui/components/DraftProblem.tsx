// Beside a form that keeps a draft: says plainly when the device would not keep it (see useDraft).
export function DraftProblem(props: { problem: string | null }) {
  if (!props.problem) return null;
  return <p class="banner banner-problem" role="status" aria-live="polite" data-testid="draft-problem">{props.problem}</p>;
}
