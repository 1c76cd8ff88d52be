// Wording shared by every way a project is opened (link, project file, exported SVG): what the restore step
// changed, and whether a link could be checked, so that nothing is changed without a word.

/** Repairs listed in full; more are counted. */
const SHOWN = 6;

/**
 * Sentences (with a leading space) naming what the restore step changed, or "" when nothing was changed.
 * @param what the subject, e.g. "The link" or "report.axband.json"
 */
export function repairsNote(repairs: readonly string[], what: string): string {
  if (repairs.length === 0) return "";
  const shown = repairs.slice(0, SHOWN).join("; ");
  const more = repairs.length > SHOWN ? `; and ${repairs.length - SHOWN} more` : "";
  const count = repairs.length === 1 ? "a repair" : `${repairs.length} repairs`;
  return ` ${what} needed ${count}, so what opened differs from the original: ${shown}${more}.`;
}

/** Said when a link of a format without checksum (before v3) was opened. */
export const UNVERIFIED_LINK_NOTE =
  " This link is in an older format without a checksum, so axband cannot check that it arrived undamaged.";

/**
 * The alert for a link that was refused. The decoder's reason already names the link and what is wrong with it
 * ("This link is damaged (…)", "This link was not opened: it holds …"), so it is not put after a second lead-in.
 */
export function linkRefusedNote(reason: string): string {
  const t = reason.trim();
  return `${/[.!?]$/.test(t) ? t : `${t}.`} Your project is unchanged.`;
}
