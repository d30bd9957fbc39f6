import { Router } from 'express';
import { actorOf } from '../audit/actor';
import { requireCapability } from '../middleware/authorize';
import { recordId } from '../speed-books/record-id';
import { issueCardCode } from './card-issues.service';
import { printAirframeCard, type IssueCode } from './card-pdf.service';

export interface CardPdfRouteOptions {
  readonly publicUrl: string;
  /** Where the printed card's code comes from; the card log by default. */
  readonly issueCode?: IssueCode;
}

/** `GET /api/airframes/:id/card.pdf?weightKg=…&departure.qnhHpa=…`: a printed card, for engineers and approvers. */
export function airframeCardPdfRoutes(options: CardPdfRouteOptions): Router {
  const router = Router();
  router.get('/:id/card.pdf', requireCapability('print-card-batches'), async (req, res) => {
    const airframeId = recordId(req.params['id'], 'That airframe');
    const printed = await printAirframeCard(actorOf(req), airframeId, req.query as Record<string, unknown>, {
      publicUrl: options.publicUrl,
      issueCode: options.issueCode ?? issueCardCode,
    });
    res
      .status(200)
      .type('application/pdf')
      .set('Content-Disposition', `attachment; filename="${printed.fileName}"`)
      .set('Cache-Control', 'no-store')
      .set('X-Card-Code', printed.code)
      .send(printed.pdf);
  });
  return router;
}
