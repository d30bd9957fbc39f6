import { Router, type Response } from 'express';
import { actorOf } from '../middleware/request-actor';
import { requireCapability } from '../middleware/authorize';
import { idParam } from '../middleware/id-param';
import { issueCardCode } from './card-issues.service';
import { printAirframeCard, reprintAirframeCard, type IssueCode, type PrintedCard } from './card-pdf.service';

export interface CardPdfRouteOptions {
  readonly publicUrl: string;
  /** Where the printed card's code comes from; the card log by default. */
  readonly issueCode?: IssueCode;
}

function sendPdf(res: Response, status: number, printed: PrintedCard): void {
  res
    .status(status)
    .type('application/pdf')
    .set('Content-Disposition', `attachment; filename="${printed.fileName}"`)
    .set('X-Card-Code', printed.code)
    .send(printed.pdf);
}

/**
 * `/api/airframes/:id/card.pdf`, for engineers and approvers. `POST ?weightKg=…&departure.qnhHpa=…`
 * issues a card (recorded in the card log, CSRF-protected like every write) and answers its PDF;
 * `GET ?code=…` prints a card already issued, writing nothing.
 */
export function airframeCardPdfRoutes(options: CardPdfRouteOptions): Router {
  const router = Router();
  router.post('/:id/card.pdf', requireCapability('print-card-batches'), async (req, res) => {
    const airframeId = idParam(req.params['id'], 'That airframe');
    const printed = await printAirframeCard(actorOf(req), airframeId, req.query as Record<string, unknown>, {
      publicUrl: options.publicUrl,
      issueCode: options.issueCode ?? issueCardCode,
    });
    res.location(`/api/airframes/${airframeId}/card.pdf?code=${printed.code}`);
    sendPdf(res, 201, printed);
  });
  router.get('/:id/card.pdf', requireCapability('print-card-batches'), async (req, res) => {
    const airframeId = idParam(req.params['id'], 'That airframe');
    sendPdf(res, 200, await reprintAirframeCard(actorOf(req), airframeId, req.query as Record<string, unknown>, { publicUrl: options.publicUrl }));
  });
  return router;
}
