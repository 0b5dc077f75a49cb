/**
 * The two groups' colours and the colour scale every group-coloured figure shares.
 */
import { displayText } from '../display-text.ts';

/**
 * Blue and orange from Okabe & Ito's colour-universal palette (Okabe & Ito 2008, "Color
 * Universal Design"), told apart by readers with the common colour-vision deficiencies.
 */
export const GROUP_COLOURS: readonly [string, string] = ['#0072B2', '#E69F00'];

/** Group names as figures show them (display-cleaned; vega escapes them when drawing). */
export function figureGroupNames(names: readonly [string, string]): [string, string] {
  return [displayText(names[0]), displayText(names[1])];
}

/** A vega-lite colour encoding on the field `group` with both groups always in the legend. */
export function groupColour(names: readonly [string, string], title = 'group') {
  return {
    field: 'group',
    type: 'nominal' as const,
    title,
    scale: { domain: figureGroupNames(names), range: [...GROUP_COLOURS] },
  };
}
