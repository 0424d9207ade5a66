// The one way a failure becomes words on screen: the store's own sentence when it has one (StoreError.userMessage),
// else the error's message. Kept apart from the screens so the app's start-up can use it without loading them.

export function errorText(err: unknown): string {
  return (err as { userMessage?: string } | null)?.userMessage ?? (err instanceof Error ? err.message : String(err));
}
