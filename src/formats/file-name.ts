// File names made from a project's name: the one rule for saved projects, figures and tables.

/**
 * The name with the characters file systems refuse (controls, / \ : * ? " < > |) replaced by "-", at most
 * 100 characters, without leading or trailing dots, spaces and dashes (Windows drops trailing dots and spaces);
 * `fallback` when nothing is left.
 */
export function safeFileName(name: string, fallback: string): string {
  const cleaned = name
    // eslint-disable-next-line no-control-regex
    .replace(/[\u0000-\u001F\u007F/\\:*?"<>|]+/g, "-")
    .slice(0, 100)
    .replace(/^[\s.-]+|[\s.-]+$/g, "");
  return cleaned || fallback;
}
