/**
 * Labelled reference lines for the charts (a bus frequency, a limit, a setting), one home for their look: a 1.5 px
 * line in the given colour and dash, its words on the panel colour. The return type is the annotation plugin's own,
 * so chart configurations that hold these lines type-check as chart options.
 */
import type { AnnotationOptions } from 'chartjs-plugin-annotation';
import type { ChartTheme } from './theme';

/** Size of a line's label: regular on the full-size charts, small on the small ones (the capability chart). */
export interface LabelSize {
  fontSize: number;
  padding: number;
}
export const REGULAR_LABEL: LabelSize = { fontSize: 11, padding: 3 };
export const SMALL_LABEL: LabelSize = { fontSize: 10, padding: 2 };

/** How a horizontal line is drawn: its dash, its label's size and where along the line the label sits. */
export interface HLineStyle {
  dash?: number[];
  size?: LabelSize;
  position?: 'start' | 'center' | 'end';
}

/** A horizontal line at `y` on the `y` scale, labelled at its start (or its middle, or its end). */
export function hLine(
  y: number,
  color: string,
  text: string,
  theme: ChartTheme,
  { dash = [6, 3], size = REGULAR_LABEL, position = 'start' }: HLineStyle = {},
): AnnotationOptions<'line'> {
  return {
    type: 'line',
    yMin: y,
    yMax: y,
    yScaleID: 'y',
    borderColor: color,
    borderWidth: 1.5,
    borderDash: dash,
    label: { display: true, content: text, position, backgroundColor: theme.panel, color: theme.fg, font: { size: size.fontSize }, padding: size.padding },
  };
}

/** A vertical line at `x` on the `x` scale, its label turned upright at `position`. */
export function vLine(
  x: number,
  color: string,
  text: string,
  theme: ChartTheme,
  dash: number[],
  position: 'start' | 'end',
  size: LabelSize = SMALL_LABEL,
): AnnotationOptions<'line'> {
  return {
    type: 'line',
    xMin: x,
    xMax: x,
    xScaleID: 'x',
    borderColor: color,
    borderWidth: 1.5,
    borderDash: dash,
    label: {
      display: true,
      content: text,
      position,
      rotation: -90,
      backgroundColor: theme.panel,
      color: theme.fg,
      font: { size: size.fontSize },
      padding: size.padding,
    },
  };
}
