import { escapeHtml } from '../../display.js';

/**
 * A label as SVG text content with sub- and superscripts drawn as shifted, smaller tspans:
 * "p_T [MeV/c]", "σ_{p}/p", "x^2" and the `<sub>`/`<sup>` tags a figure spec may carry.
 * Everything else is escaped. snake_case words ("sigma_p_meas") are left as they are.
 * @example svgLabel('p_T [GeV/c]') // 'p<tspan baseline-shift="sub" font-size="75%">T</tspan> [GeV/c]'
 */
export function svgLabel(text: string): string {
  const sub = (s: string) => `<tspan baseline-shift="sub" font-size="75%">${s}</tspan>`;
  const sup = (s: string) => `<tspan baseline-shift="super" font-size="75%">${s}</tspan>`;
  let t = escapeHtml(text)
    .replace(/&lt;sub&gt;(.*?)&lt;\/sub&gt;/g, (_, s: string) => sub(s))
    .replace(/&lt;sup&gt;(.*?)&lt;\/sup&gt;/g, (_, s: string) => sup(s))
    .replace(/&lt;br\s*\/?&gt;/g, ' ');
  if (/[A-Za-z0-9]_[A-Za-z0-9]+_/.test(text)) return t;
  t = t
    .replace(/_\{([^{}]+)\}/g, (_, s: string) => sub(s))
    .replace(/\^\{([^{}]+)\}/g, (_, s: string) => sup(s))
    .replace(/(?<=[\p{L}\p{N})\]])_([\p{L}\p{N}]{1,2})(?![\p{L}\p{N}])/gu, (_, s: string) => sub(s))
    .replace(/(?<=[\p{L}\p{N})\]])\^([+-]?[\p{L}\p{N}]+)/gu, (_, s: string) => sup(s));
  return t;
}

/** The label's visible characters (tags and markup removed), for width estimates. */
export function plainLabel(text: string): string {
  return text.replace(/<\/?su[bp]>/g, '').replace(/[_^]\{([^{}]+)\}/g, '$1').replace(/(?<=\S)[_^](?=\S)/g, '');
}

/** Estimated width in px of a label at `fontPx` (an average glyph is about 0.55 em wide). */
export function labelWidth(text: string, fontPx: number): number {
  return [...plainLabel(text)].length * fontPx * 0.55;
}
