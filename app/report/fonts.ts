// The fonts embedded in every PDF: DejaVu Sans regular and bold from the dejavu-fonts-ttf
// package, found through Node's resolver so it works from the repository and from the CLI.

import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

export interface ReportFonts {
  regular: Uint8Array;
  bold: Uint8Array;
}

function resolver(): NodeJS.Require {
  // Under ESM import.meta.url is set; a CommonJS bundle (the desktop main process) has `require`.
  const url = typeof import.meta === 'object' && typeof import.meta.url === 'string' ? import.meta.url : undefined;
  if (url !== undefined) return createRequire(url);
  return require;
}

let cached: ReportFonts | null = null;

/** Read both fonts once. Throws with the file it looked for when the package is missing. */
export function loadReportFonts(): ReportFonts {
  if (cached !== null) return cached;
  const req = resolver();
  const read = (file: string): Uint8Array => {
    const id = `dejavu-fonts-ttf/ttf/${file}`;
    let path: string;
    try {
      path = req.resolve(id);
    } catch {
      throw new Error(`the printout font ${id} was not found (is the dejavu-fonts-ttf package installed?)`);
    }
    return new Uint8Array(readFileSync(path));
  };
  cached = { regular: read('DejaVuSans.ttf'), bold: read('DejaVuSans-Bold.ttf') };
  return cached;
}
