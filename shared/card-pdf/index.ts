/** The printed speed card: one document definition for the browser and for Node (see card-document.ts). */
export { cardPdf, revisionNoteText, type CardPdf, type CardPdfInput } from './card-document';
export { cardPdfFileName } from './file-name';
export { CARD_FONTS, CARD_FONT_FILES, BROWSER_FONT_PATH, cardFontDictionary, cardFontFiles, type CardFontFile } from './fonts';
export { CARD_PAPERS, CARD_PAPER_SIZES, isCardPaperSize, type CardPaper, type CardPaperSize } from './page-sizes';
export { qrVector } from './qr';
export { NO_CHANGES, cardChanges, cardLines, lineKey, previousCardOf, type CardChanges, type PreviousCard } from './revision-marks';
