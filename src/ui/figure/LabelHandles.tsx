// Handles over the direct labels (legend "on-plot"): transparent buttons laid over each label's box, outside the
// svg (an image role has no interactive children), that move it by drag or arrow keys and put it back with Delete.
import type { RefObject } from "react";
import type { Scene } from "../../plot/scene-types";
import { useLabelDrag } from "./useLabelDrag";
import "./label-handles.css";

type DirectLabel = NonNullable<Scene["directLabels"]>[number];

interface HandleProps {
  label: DirectLabel;
  scene: Scene;
  boxRef: RefObject<HTMLDivElement | null>;
}

/** Percent of the scene's size, for placing a handle in the figure box (which has the scene's aspect). */
const pct = (v: number, of: number) => `${((v / of) * 100).toFixed(3)}%`;

function LabelHandle({ label, scene, boxRef }: HandleProps) {
  const handlers = useLabelDrag(label, () => {
    const w = boxRef.current?.getBoundingClientRect().width ?? 0;
    return w > 0 ? { scene, pxPerScenePx: w / scene.widthPx } : null;
  });
  const { box } = label;
  return (
    <button
      type="button"
      className="direct-label-handle"
      data-testid="direct-label-handle"
      data-label-kind={label.kind}
      data-label-id={label.id}
      data-moved={label.pinned ? "true" : "false"}
      aria-label={`Label “${label.text}”: drag or use the arrow keys to move it, Delete to place it automatically`}
      title="Drag to move; Delete puts it back"
      style={{
        left: pct(box.x, scene.widthPx),
        top: pct(box.y, scene.heightPx),
        width: pct(box.w, scene.widthPx),
        height: pct(box.h, scene.heightPx),
      }}
      {...handlers}
    />
  );
}

/** One handle per direct label of the scene (none unless the legend is "on-plot"). */
export function LabelHandles({ scene, boxRef }: { scene: Scene; boxRef: RefObject<HTMLDivElement | null> }) {
  if (!scene.directLabels?.length) return null;
  return (
    <>
      {scene.directLabels.map((l) => (
        <LabelHandle key={`${l.kind}:${l.id}`} label={l} scene={scene} boxRef={boxRef} />
      ))}
    </>
  );
}
