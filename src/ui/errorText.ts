// The one way a failure becomes words on screen: the store's own sentence when it has one (StoreError.userMessage),
// else the error's message. Kept apart from the screens so the app's start-up can use it without loading them.

/** The store's own sentence for a failure (StoreError.userMessage), if it has one. */
export function storeSentence(err: unknown): string | undefined {
  return (err as { userMessage?: string } | null | undefined)?.userMessage;
}

export function errorText(err: unknown): string {
  return storeSentence(err) ?? (err instanceof Error ? err.message : String(err));
}
