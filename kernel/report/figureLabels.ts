import { escapeHtml } from '../../lib/internal.js';

/**
 * Axis titles, figure titles and trace names with TeX-style sub- and superscripts rendered, as
 * the plotting library draws `<sub>`/`<sup>`: "p_T [MeV/c]" → "p<sub>T</sub> [MeV/c]",
 * "σ_{p}/p" and "x^2" likewise. Text is escaped first; an underscore inside a word that is not
 * a subscript (snake_case like "sigma_p_meas") is left alone when more letters follow a second
 * underscore.
 * @example richLabel('true p_T [MeV/c]') // 'true p<sub>T</sub> [MeV/c]'
 */
export function richLabel(text: string): string {
  if (/[A-Za-z0-9]_[A-Za-z0-9]+_/.test(text)) return escapeHtml(text);
  return escapeHtml(text)
    .replace(/_\{([^{}]+)\}/g, '<sub>$1</sub>')
    .replace(/\^\{([^{}]+)\}/g, '<sup>$1</sup>')
    .replace(/(?<=[\p{L}\p{N})\]])_([\p{L}\p{N}]{1,2})(?![\p{L}\p{N}])/gu, "<sub>$1</sub>")
    .replace(/(?<=[\p{L}\p{N})\]])\^([+-]?[\p{L}\p{N}]+)/gu, '<sup>$1</sup>');
}

type Spec = { data?: Array<Record<string, unknown>>; layout?: Record<string, unknown> };

/** A copy of a figure spec whose titles and trace names use `richLabel`. */
export function withRichLabels(spec: unknown): unknown {
  if (spec === null || typeof spec !== 'object') return spec;
  const s = structuredClone(spec) as Spec;
  const fix = (holder: Record<string, unknown> | undefined, key: string) => {
    if (!holder) return;
    const v = holder[key];
    if (typeof v === 'string') holder[key] = richLabel(v);
    else if (v && typeof v === 'object' && typeof (v as { text?: unknown }).text === 'string') (v as { text: string }).text = richLabel((v as { text: string }).text);
  };
  fix(s.layout, 'title');
  for (const [key, axis] of Object.entries(s.layout ?? {})) {
    if (/^[xy]axis\d*$/.test(key) && axis && typeof axis === 'object') fix(axis as Record<string, unknown>, 'title');
  }
  for (const trace of s.data ?? []) fix(trace, 'name');
  return s;
}
