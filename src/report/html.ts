/**
 * A tagged template that escapes by default: every interpolated string goes through
 * escapeHtml unless it is already markup made by this module (a {@link Markup} value).
 */
import { escapeHtml } from './escape.ts';

/** Markup that is safe to insert as is, because it was built by `html` or vetted by `trustedSvg`. */
export class Markup {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

export type HtmlValue = Markup | string | number | null | undefined | false | HtmlValue[];

function renderValue(v: HtmlValue): string {
  if (v instanceof Markup) return v.value;
  if (Array.isArray(v)) return v.map(renderValue).join('');
  if (v === null || v === undefined || v === false) return '';
  return escapeHtml(String(v));
}

/**
 * Builds markup from a template literal, escaping every interpolated value (strings, numbers)
 * and inserting Markup values and arrays of them unchanged. `null`, `undefined` and `false`
 * insert nothing.
 *
 * @example html`<td>${'<x>'}</td>`.value // '<td>&lt;x&gt;</td>'
 */
export function html(strings: TemplateStringsArray, ...values: HtmlValue[]): Markup {
  let out = strings[0];
  for (let i = 0; i < values.length; i++) out += renderValue(values[i]) + strings[i + 1];
  return new Markup(out);
}

/** Patterns an SVG made from our own specs can never contain; their presence means a bug or an injection. */
const FORBIDDEN_IN_SVG = /<script|<foreignObject|<iframe|<image|\son[a-z]+\s*=|href\s*=|javascript:|<style/i;

/**
 * Accepts an SVG string rendered by vega as markup after checking that it holds no script,
 * event-handler attribute, link, external image or foreign object.
 * Throws an Error naming the figure otherwise (an internal error: vega escapes the text it draws).
 *
 * @example trustedSvg('<svg width="1" height="1"></svg>', 'test').value // '<svg width="1" height="1"></svg>'
 */
export function trustedSvg(svg: string, figure: string): Markup {
  const bad = FORBIDDEN_IN_SVG.exec(svg);
  if (bad) throw new Error(`report figure "${figure}": rendered SVG contains "${bad[0]}", which a static figure never needs`);
  return new Markup(svg);
}
