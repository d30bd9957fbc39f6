/**
 * The fonts of the printed card: Roboto for words, Roboto Mono for figures, the latin subset of
 * the @fontsource files the app ships (WOFF 1: pdfmake reads .woff and .ttf, not .woff2). Node
 * reads them from node_modules/@fontsource/<package>/files; the browser fetches them from the
 * app's `/pdf-fonts/` assets (angular.json), which the service worker keeps for offline printing.
 */

/** pdfmake font family names the document definition uses. */
export const CARD_FONTS = { text: 'Roboto', figures: 'RobotoMono' } as const;

export interface CardFontFile {
  /** The @fontsource package it ships in. */
  readonly fontsourcePackage: '@fontsource/roboto' | '@fontsource/roboto-mono';
  readonly file: string;
}

/** Family → pdfmake style → file. The card uses no italics. */
export const CARD_FONT_FILES: Readonly<Record<(typeof CARD_FONTS)[keyof typeof CARD_FONTS], { readonly normal: CardFontFile; readonly bold: CardFontFile }>> = {
  Roboto: {
    normal: { fontsourcePackage: '@fontsource/roboto', file: 'roboto-latin-400-normal.woff' },
    bold: { fontsourcePackage: '@fontsource/roboto', file: 'roboto-latin-700-normal.woff' },
  },
  RobotoMono: {
    normal: { fontsourcePackage: '@fontsource/roboto-mono', file: 'roboto-mono-latin-400-normal.woff' },
    bold: { fontsourcePackage: '@fontsource/roboto-mono', file: 'roboto-mono-latin-700-normal.woff' },
  },
};

/** Where the browser finds the files (angular.json copies them there). */
export const BROWSER_FONT_PATH = '/pdf-fonts/';

/** Every file once, for loaders. */
export function cardFontFiles(): CardFontFile[] {
  return Object.values(CARD_FONT_FILES).flatMap((family) => [family.normal, family.bold]);
}

/**
 * pdfmake's font dictionary with each file named by `locate` (a path in Node, a virtual file
 * name in the browser).
 */
export function cardFontDictionary(locate: (font: CardFontFile) => string): Record<string, { normal: string; bold: string; italics: string; bolditalics: string }> {
  const dictionary: Record<string, { normal: string; bold: string; italics: string; bolditalics: string }> = {};
  for (const [family, files] of Object.entries(CARD_FONT_FILES)) {
    // No italics on the card; pdfmake wants the keys, so they name the upright files.
    dictionary[family] = { normal: locate(files.normal), bold: locate(files.bold), italics: locate(files.normal), bolditalics: locate(files.bold) };
  }
  return dictionary;
}
