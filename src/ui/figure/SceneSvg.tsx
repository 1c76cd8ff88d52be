// The figure on screen: an <svg> kept in line with the Scene by scene-dom.ts (the markup writeSvg writes);
// React owns the root element and the screen-only overlays above the scene.
import { useCallback, useLayoutEffect, useRef, type ReactNode, type Ref, type SVGProps } from "react";
import type { Scene } from "../../plot/scene-types";
import { fmt } from "../../plot/svg";
import { createSceneDom, type SceneDom } from "./scene-dom";
// The figure fonts' webfonts (OFL), so the screen shows the face the SVG names and the PNG and PDF embed.
import "computer-modern/cmu-sans-serif.css";
import "computer-modern/cmu-serif.css";

export interface SceneSvgProps extends Omit<SVGProps<SVGSVGElement>, "viewBox" | "ref"> {
  /** Screen-only overlays drawn above the scene (never part of the export), inside <g data-overlay>. */
  children?: ReactNode;
  scene: Scene;
  /** Prefix of every id (several figures on one page must not share ids). */
  idPrefix: string;
  ref?: Ref<SVGSVGElement>;
}

/** The scene as an <svg> with a viewBox in scene px; CSS decides the displayed size. */
export function SceneSvg({ scene, idPrefix, children, ref, ...rest }: SceneSvgProps) {
  const svgRef = useRef<SVGSVGElement | null>(null);
  const overlayRef = useRef<SVGGElement | null>(null);
  const dom = useRef<SceneDom | null>(null);
  const setSvg = useCallback(
    (el: SVGSVGElement | null) => {
      svgRef.current = el;
      if (typeof ref === "function") ref(el);
      else if (ref) (ref as { current: SVGSVGElement | null }).current = el;
    },
    [ref],
  );
  // One renderer per prefix (ids change with it); created before the scene effect below runs.
  useLayoutEffect(() => {
    const svg = svgRef.current;
    if (!svg) return;
    const d = createSceneDom(svg, overlayRef.current, idPrefix);
    dom.current = d;
    return () => {
      d.destroy();
      dom.current = null;
    };
  }, [idPrefix]);
  // Layout effect: the new scene is in the DOM before the browser paints the frame.
  useLayoutEffect(() => {
    dom.current?.update(scene);
  }, [scene, idPrefix]);
  return (
    <svg
      ref={setSvg}
      xmlns="http://www.w3.org/2000/svg"
      viewBox={`0 0 ${fmt(scene.widthPx)} ${fmt(scene.heightPx)}`}
      fontFamily={scene.fontFamily}
      strokeLinecap="butt"
      {...rest}
    >
      <g ref={overlayRef} data-overlay="">
        {children}
      </g>
    </svg>
  );
}
