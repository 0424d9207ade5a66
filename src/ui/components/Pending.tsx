/** Shown in an area whose tools have not landed in this build yet: says so plainly instead of faking output. */
export function Pending(props: { title: string; what: string }) {
  return (
    <section class="screen">
      <h1>{props.title}</h1>
      <p class="lede">{props.what}</p>
      <p class="notice">Not in this build yet. The other areas work offline as usual.</p>
    </section>
  );
}
