/**
 * The tile layers shared by the heatmaps: vega-lite leaves null values out of a colour scale,
 * so tiles whose value is missing get a grey layer of their own and the rest are coloured.
 */
import type { TopLevelSpec } from 'vega-lite';

/** One layer of a vega-lite layer specification (the package exports only TopLevelSpec). */
type Layer = Extract<TopLevelSpec, { layer: unknown }>['layer'][number];

/**
 * Two rect layers over the data: grey tiles where `field` is null, tiles coloured by `color`
 * (a vega-lite colour channel on `field`) elsewhere, both outlined in white.
 *
 * @example heatTileLayers('auc', 1, { field: 'auc', type: 'quantitative' }) // [grey layer, coloured layer]
 */
export function heatTileLayers(field: string, strokeWidth: number, color: object): Layer[] {
  return [
    {
      transform: [{ filter: `datum.${field} === null` }],
      mark: { type: 'rect', stroke: 'white', strokeWidth, color: '#d9d9d9' },
    },
    {
      transform: [{ filter: `datum.${field} !== null` }],
      mark: { type: 'rect', stroke: 'white', strokeWidth },
      encoding: { color },
    },
  ] as Layer[];
}
