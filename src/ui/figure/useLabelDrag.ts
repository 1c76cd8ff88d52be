// Moving a direct label (legend "on-plot") by pointer or keyboard: the new place is stored on its curve or model
// as a data point (labelAt), one undo step per drag or key burst; Delete puts the label back to its automatic place.
import { useRef, type KeyboardEvent, type PointerEvent } from "react";
import { labelAtOf } from "../../plot/direct-label-nodes";
import { constantsOf } from "../../plot/physics-settings";
import type { Scene } from "../../plot/scene-types";
import type { LabelAt, Project } from "../../project/types";
import { useAxband } from "../store";

type DirectLabel = NonNullable<Scene["directLabels"]>[number];

/** Scene px one arrow key press moves a label (Shift: five times as far). */
export const LABEL_KEY_STEP_PX = 4;

/** Stores a label's place (or none: automatic) on its curve or model, merging a burst into one undo step. */
export function setLabelAt(label: Pick<DirectLabel, "kind" | "id">, at: LabelAt | undefined): void {
  const s = useAxband.getState();
  const opts = { coalesceKey: `label:${label.kind}:${label.id}` };
  if (label.kind === "curve") s.updateCurve(label.id, { labelAt: at }, opts);
  else s.updateModel(label.id, { labelAt: at }, opts);
}

/** Every label back to its automatic place, as one undo step. */
export function resetLabelPositions(): void {
  const strip = <T extends { labelAt?: LabelAt }>(x: T): T => {
    if (!x.labelAt) return x;
    const copy = { ...x };
    delete copy.labelAt;
    return copy;
  };
  useAxband.getState().commit((p: Project) => ({ ...p, models: p.models.map(strip), curves: p.curves.map(strip) }));
}

/** Whether any curve or model has a label placed by the user. */
export function anyLabelMoved(p: Project): boolean {
  return p.models.some((m) => m.labelAt) || p.curves.some((c) => c.labelAt);
}

/**
 * Pointer and key handlers of one label's handle. `sceneOf` gives the scene last drawn and the handle's box
 * element size on screen (client px per scene px), read at event time.
 */
export function useLabelDrag(label: DirectLabel, sceneOf: () => { scene: Scene; pxPerScenePx: number } | null) {
  const drag = useRef<{ id: number; x: number; y: number; cx: number; cy: number } | null>(null);
  const moveTo = (cx: number, cy: number) => {
    const s = sceneOf();
    if (!s) return;
    const physics = useAxband.getState().project.physics;
    setLabelAt(label, labelAtOf(cx, cy, s.scene, constantsOf(physics)));
  };
  const centre = () => ({ cx: label.box.x + label.box.w / 2, cy: label.box.y + label.box.h / 2 });
  const onPointerDown = (e: PointerEvent<HTMLElement>) => {
    if (e.button !== 0) return;
    e.preventDefault();
    e.currentTarget.setPointerCapture?.(e.pointerId);
    e.currentTarget.focus();
    drag.current = { id: e.pointerId, x: e.clientX, y: e.clientY, ...centre() };
  };
  const onPointerMove = (e: PointerEvent<HTMLElement>) => {
    const d = drag.current;
    const s = sceneOf();
    if (!d || d.id !== e.pointerId || !s) return;
    moveTo(d.cx + (e.clientX - d.x) / s.pxPerScenePx, d.cy + (e.clientY - d.y) / s.pxPerScenePx);
  };
  const onPointerUp = (e: PointerEvent<HTMLElement>) => {
    if (drag.current?.id !== e.pointerId) return;
    drag.current = null;
    e.currentTarget.releasePointerCapture?.(e.pointerId);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLElement>) => {
    const step = LABEL_KEY_STEP_PX * (e.shiftKey ? 5 : 1);
    const move: Record<string, [number, number]> = {
      ArrowLeft: [-step, 0],
      ArrowRight: [step, 0],
      ArrowUp: [0, -step],
      ArrowDown: [0, step],
    };
    if (e.key === "Delete" || e.key === "Backspace") {
      e.preventDefault();
      return setLabelAt(label, undefined);
    }
    const m = move[e.key];
    if (!m) return;
    e.preventDefault();
    const { cx, cy } = centre();
    moveTo(cx + m[0], cy + m[1]);
  };
  return { onPointerDown, onPointerMove, onPointerUp, onPointerCancel: onPointerUp, onKeyDown };
}
