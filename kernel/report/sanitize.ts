import sanitizeHtml from 'sanitize-html';

/**
 * The allowlist for HTML that did not come from Sagitta's own templates: raw HTML in markdown
 * cells and `text/html` outputs of cells. Scripts, event handlers, styles, frames, forms and
 * non-data image sources are removed; MathML (what KaTeX writes) and tables are kept.
 */
const MATHML_TAGS = [
  'math', 'semantics', 'annotation', 'mrow', 'mi', 'mo', 'mn', 'ms', 'mtext', 'mspace', 'msup', 'msub', 'msubsup',
  'mfrac', 'msqrt', 'mroot', 'mover', 'munder', 'munderover', 'mtable', 'mtr', 'mtd', 'mpadded', 'mphantom',
  'menclose', 'mstyle', 'merror', 'mmultiscripts', 'mprescripts', 'none',
];

const MATHML_ATTRIBUTES = [
  'xmlns', 'display', 'encoding', 'mathvariant', 'stretchy', 'fence', 'separator', 'lspace', 'rspace', 'minsize',
  'maxsize', 'accent', 'accentunder', 'largeop', 'movablelimits', 'symmetric', 'width', 'height', 'depth',
  'voffset', 'linethickness', 'notation', 'scriptlevel', 'displaystyle', 'columnalign', 'rowalign',
  'columnspacing', 'rowspacing', 'columnlines', 'rowlines', 'frame', 'mathcolor', 'mathbackground',
];

const OPTIONS: sanitizeHtml.IOptions = {
  allowedTags: [
    ...sanitizeHtml.defaults.allowedTags,
    'img', 'h1', 'h2', 'del', 's', 'ins', 'sup', 'sub', 'span', 'details', 'summary', 'figure', 'figcaption',
    ...MATHML_TAGS,
  ],
  allowedAttributes: {
    '*': ['class', 'title', 'lang', 'dir'],
    a: ['href', 'name', 'rel', 'target'],
    img: ['src', 'alt', 'width', 'height'],
    th: ['colspan', 'rowspan', 'align', 'scope'],
    td: ['colspan', 'rowspan', 'align'],
    ol: ['start', 'reversed', 'type'],
    code: ['class'],
    ...Object.fromEntries(MATHML_TAGS.map((t) => [t, MATHML_ATTRIBUTES])),
  },
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: { img: ['data'] },
  allowProtocolRelative: false,
  // Raster and SVG data images only: an SVG shown through <img> cannot run scripts.
  exclusiveFilter: (frame) => frame.tag === 'img' && !/^data:image\/(png|jpeg|gif|webp|svg\+xml)[;,]/i.test(frame.attribs.src ?? ''),
  transformTags: {
    a: (tagName, attribs) => ({ tagName, attribs: { ...attribs, rel: 'noopener noreferrer', target: '_blank' } }),
  },
  parser: { lowerCaseAttributeNames: false },
};

/** Removes everything outside the allowlist from untrusted HTML. */
export function sanitize(html: string): string {
  return sanitizeHtml(html, OPTIONS);
}
