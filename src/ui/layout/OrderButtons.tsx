// Move up, move down and remove: the buttons at the end of every row of the curve and model lists.

export function OrderButtons(props: {
  /** The row's label, for the buttons' accessible names. */
  label: string;
  index: number;
  count: number;
  move: (delta: -1 | 1) => void;
  remove: () => void;
}) {
  const { label, index, count, move, remove } = props;
  return (
    <>
      <button
        type="button"
        className="icon"
        aria-label={`Move ${label} up`}
        disabled={index === 0}
        onClick={() => move(-1)}
      >
        ↑
      </button>
      <button
        type="button"
        className="icon"
        aria-label={`Move ${label} down`}
        disabled={index === count - 1}
        onClick={() => move(1)}
      >
        ↓
      </button>
      <button type="button" className="icon danger" aria-label={`Remove ${label}`} onClick={remove}>
        ✕
      </button>
    </>
  );
}
