/**
 * One card issued through the card log on a database seeded with the demo data, as the demo
 * pilot's device reports it (re-derived with the shared card engine), and its check URL — what
 * the printed card's QR code opens. For the first-visit benchmark and end-to-end test.
 */
import { randomUUID } from 'node:crypto';
import { recordCardIssue } from '../../server/cards/card-issues.service';
import { loadCardSource } from '../../server/cards/card-source';
import { createSequelize } from '../../db/connection';
import { AircraftType, Airframe, initModels, Revision, SpeedBook, User } from '../../server/models';
import { checkUrl } from '@shared/card-check/check-url';
import { buildCard } from '@shared/card/build-card';
import type { CardInputs } from '@shared/card/card';

export async function issueDemoCard(databaseUrl: string, baseUrl: string): Promise<{ code: string; url: string }> {
  const sequelize = createSequelize(databaseUrl);
  initModels(sequelize);
  try {
    const pilot = await User.findOne({ where: { email: 'pilot@demo.speedwright.example' }, rejectOnEmpty: true });
    const actor = { operatorId: pilot.operatorId, userId: pilot.id, role: pilot.role };
    const type = await AircraftType.findOne({ where: { operatorId: pilot.operatorId, designator: 'ZZP1' }, rejectOnEmpty: true });
    const book = await SpeedBook.findOne({ where: { aircraftTypeId: type.id }, rejectOnEmpty: true });
    const revision = await Revision.findOne({ where: { speedBookId: book.id, status: 'published' }, rejectOnEmpty: true });
    const airframe = await Airframe.findOne({ where: { aircraftTypeId: type.id, active: true }, rejectOnEmpty: true });
    const source = await loadCardSource(actor, revision.id, airframe.id, 'issue');
    // Invented demo data — not for flight.
    const inputs: CardInputs = {
      airframeId: airframe.id,
      weightKg: 950,
      configuration: 'takeoff-flap',
      departure: { elevationFt: 400, qnhHpa: 1016, oatC: 18 },
      isaDeviationC: 3,
      cruise: { iasKt: 110 },
      altitudeStepFt: 2000,
    };
    const card = buildCard(source.revision, inputs, source.context);
    const result = await recordCardIssue(actor, { id: randomUUID(), airframeId: airframe.id, revisionId: revision.id, inputs, digest: card.digest, issuedAt: new Date().toISOString() });
    if (result.outcome !== 'recorded') throw new Error(`The card was not recorded: ${result.error.message}`);
    return { code: result.code, url: checkUrl(baseUrl, result.code, { revisionId: revision.id, inputs: card.inputs, digest: card.digest }) };
  } finally {
    await sequelize.close();
  }
}
