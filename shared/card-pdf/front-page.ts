/** The front page of the printed card: the inputs and check block, the speeds, the limits. */
import type { Content } from 'pdfmake/interfaces';
import { cardNumber } from '../card/card-presentation';
import type { CardPdfInput } from './card-pdf-input';
import { checkBlock, inputsTable } from './inputs-block';
import { BAR_WIDTH, FIGURES_LAYOUT, INDENT, fine, title } from './pdf-blocks';
import { limitsTable, speedsTable } from './speeds-block';

/** The front of the card, `width` wide: inputs, check code, speeds, limits. */
export function frontPage(input: CardPdfInput, width: number): Content {
  const { card, changes } = input;
  const marked = (key: string) => changes.changed.has(key);
  const qrSize = 76;
  const check = checkBlock(input.checkUrl, qrSize);
  const { widths: speedWidths, body: speedBody, showWeight } = speedsTable(card, marked);
  const limitBody = limitsTable(card, marked);

  const basis = card.limits.basis === 'ias' ? 'IAS' : 'CAS';
  const content: Content[] = [
    {
      columns: [
        { width: '*', stack: [{ text: 'INPUTS OF THIS CARD', bold: true, fontSize: 6.5, characterSpacing: 0.6, margin: [INDENT, 0, 0, 1.5] }, inputsTable(card, marked)] },
        { width: qrSize, stack: check },
      ],
      columnGap: 6,
    },
    title(`Speeds at ${cardNumber(card.inputs.weightKg)} kg`, 5),
    { table: { headerRows: 1, dontBreakRows: true, widths: speedWidths, body: speedBody }, layout: FIGURES_LAYOUT },
    fine(`IAS through the speed book's position-error table. Stall and minimum speeds (V2, VREF, VMC) rounded up, limits down, other speeds to the nearest knot.${showWeight ? ' Approach and landing speeds at the landing weight.' : ''}`),
    {
      stack: [
        title('Limits', 5),
        { table: { headerRows: 1, widths: [BAR_WIDTH, 36, '*', 36, 30], body: limitBody }, layout: FIGURES_LAYOUT },
        fine(`Kt, rounded down (VMC up); limits in ${basis} as the speed book states them.`),
      ],
      unbreakable: true,
    },
  ];
  if (input.changes.removed.length) {
    content.push(fine(`Given by revision ${input.changes.againstRevision} but not by this one: ${input.changes.removed.join('; ')}.`));
  }
  void width;
  return { stack: content };
}
