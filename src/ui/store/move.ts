// Reordering helper shared by the models and curves slices.

/** The list with the item `id` moved by `delta` places (clamped); the same array when nothing moves. */
export function moveItem<T extends { id: string }>(items: T[], id: string, delta: number): T[] {
  const from = items.findIndex((x) => x.id === id);
  if (from < 0) return items;
  const to = Math.max(0, Math.min(items.length - 1, from + Math.trunc(delta)));
  if (to === from) return items;
  const next = items.slice();
  const [item] = next.splice(from, 1);
  next.splice(to, 0, item);
  return next;
}
