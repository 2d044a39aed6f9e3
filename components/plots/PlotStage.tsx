'use client';
import type { Context } from 'konva/lib/Context';
import { Layer, Shape, Stage } from 'react-konva';
import { useElementWidth } from './useElementWidth';

export interface PlotStageProps {
  title: string;
  /** Text alternative: what the plot shows, in numbers. */
  description: string;
  height?: number;
  draw: (ctx: Context, width: number, height: number) => void;
  children?: React.ReactNode;
}

/**
 * One plot: a figure with a title, a Konva stage sized to its container, and a text
 * description for screen readers. The whole plot is one Shape on a non-listening layer:
 * it draws once per data change and costs nothing on pointer moves.
 */
export function PlotStage({ title, description, height = 200, draw, children }: PlotStageProps) {
  const { ref, width } = useElementWidth<HTMLDivElement>();
  return (
    <figure className="min-w-0">
      <figcaption className="mb-1 text-xs font-semibold uppercase tracking-wide text-ink-muted">{title}</figcaption>
      <div ref={ref} role="img" aria-label={`${title}. ${description}`} className="w-full">
        <Stage width={width} height={height}>
          <Layer listening={false}>
            <Shape sceneFunc={(ctx) => draw(ctx, width, height)} />
          </Layer>
        </Stage>
      </div>
      {children}
    </figure>
  );
}
