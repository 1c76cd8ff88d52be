// Copies text to the clipboard where the browser allows it; tells the caller when it could not, so the UI
// can fall back to selecting the text in a field for the user to copy by hand.

/** Writes text to the clipboard. Resolves true when it was copied, false when the clipboard is unavailable. */
export async function copyText(text: string): Promise<boolean> {
  try {
    if (
      typeof navigator !== "undefined" &&
      navigator.clipboard &&
      typeof navigator.clipboard.writeText === "function"
    ) {
      await navigator.clipboard.writeText(text);
      return true;
    }
  } catch {
    // Permission refused or no secure context: the caller selects the field instead.
  }
  return false;
}
