import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';

/** The part of @resvg/resvg-js we use (loaded on first use: a native module). */
interface ResvgModule {
  Resvg: new (svg: string, options: Record<string, unknown>) => { render(): { asPng(): Uint8Array } };
}

let resvg: ResvgModule | undefined;

/**
 * Font files the rasteriser is given, the first that exist on this machine (sans-serif faces
 * with Greek, super- and subscript digits and the minus sign). Loading named files instead of
 * every system font keeps a render fast and the same on every machine that has them.
 */
const FONT_FILES = Object.freeze([
  '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf',
  '/usr/share/fonts/truetype/liberation/LiberationSans-Regular.ttf',
  '/usr/share/fonts/dejavu/DejaVuSans.ttf',
  '/Library/Fonts/Arial Unicode.ttf',
  'C:\\Windows\\Fonts\\arial.ttf',
]);

let fonts: { files: string[]; family: string } | undefined;

function fontChoice(): { files: string[]; family: string } {
  if (!fonts) {
    const files = FONT_FILES.filter((p) => existsSync(p));
    fonts = { files, family: files[0]?.includes('Liberation') ? 'Liberation Sans' : files[0]?.includes('arial') || files[0]?.includes('Arial') ? 'Arial' : 'DejaVu Sans' };
  }
  return fonts;
}

/**
 * An SVG document rasterised to PNG bytes with resvg (a well-kept Rust rasteriser, prebuilt for
 * each platform), at `scale` × its own size. Text uses the first font of FONT_FILES found, or
 * the system's fonts when none is; a machine without any font draws the picture without text.
 * @example svgToPng(figureSvg(spec)).subarray(1, 4) // 'PNG'
 */
export function svgToPng(svg: string, scale = 1): Uint8Array {
  resvg ??= createRequire(import.meta.url)('@resvg/resvg-js') as ResvgModule;
  const { files, family } = fontChoice();
  const r = new resvg.Resvg(svg, {
    fitTo: scale === 1 ? { mode: 'original' } : { mode: 'zoom', value: scale },
    font: { loadSystemFonts: files.length === 0, fontFiles: files, defaultFontFamily: family, sansSerifFamily: family },
    background: undefined,
  });
  return r.render().asPng();
}
