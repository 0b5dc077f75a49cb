/**
 * Which calls of the grid engine compute a given set of cells and nothing else.
 */
import type { Cell, Grid } from '../features/index.ts';

/**
 * Splits a set of cells into grids whose union is exactly that set: per scale, the delays
 * that need the same orders share one grid (so one coarse-graining and one scan per delay
 * serve all their orders, as in a full-grid computation). O(cells log cells).
 * Empty input gives no grid.
 * Example: cells (3,1,1) (4,1,1) (3,1,2) -> [{order [3,4], delay [1], scale [1]}, {order [3], delay [1], scale [2]}].
 */
export function gridsCovering(cells: readonly Cell[]): Grid[] {
  const byScale = new Map<number, Map<number, Set<number>>>();
  for (const c of cells) {
    const delays = byScale.get(c.scale) ?? new Map<number, Set<number>>();
    byScale.set(c.scale, delays);
    const orders = delays.get(c.delay) ?? new Set<number>();
    delays.set(c.delay, orders);
    orders.add(c.order);
  }
  const grids: Grid[] = [];
  for (const scale of [...byScale.keys()].sort((a, b) => a - b)) {
    const byOrders = new Map<string, { order: number[]; delay: number[] }>();
    const delays = byScale.get(scale)!;
    for (const delay of [...delays.keys()].sort((a, b) => a - b)) {
      const order = [...delays.get(delay)!].sort((a, b) => a - b);
      const key = order.join(',');
      const group = byOrders.get(key) ?? { order, delay: [] };
      byOrders.set(key, group);
      group.delay.push(delay);
    }
    for (const g of byOrders.values()) grids.push({ order: g.order, delay: g.delay, scale: [scale] });
  }
  return grids;
}

/**
 * The cells of a grid in the order the grid engine returns them: scale, then delay, then
 * order, each axis sorted ascending without repeats.
 * Example: gridCells({ order: [4, 3], delay: [1], scale: [2, 1] }) -> (3,1,1) (4,1,1) (3,1,2) (4,1,2).
 */
export function gridCells(grid: Grid): Cell[] {
  const axis = (v: number[]) => [...new Set(v)].sort((a, b) => a - b);
  const cells: Cell[] = [];
  for (const scale of axis(grid.scale)) for (const delay of axis(grid.delay)) for (const order of axis(grid.order)) cells.push({ order, delay, scale });
  return cells;
}

/** Text key of a cell, e.g. "3/1/2" for order 3, delay 1, scale 2. */
export const cellId = (c: Cell): string => `${c.order}/${c.delay}/${c.scale}`;
