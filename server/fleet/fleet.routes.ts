import { Router } from 'express';
import {
  createAircraftTypeSchema,
  createAirframeSchema,
  updateAircraftTypeSchema,
  updateAirframeSchema,
} from '@shared/api/fleet';
import { actorOf } from '../middleware/request-actor';
import { operatorScope, requireCapability } from '../middleware/authorize';
import { parseOrThrow } from '../middleware/validate';
import { idParam } from '../middleware/id-param';
import * as fleet from './fleet.service';

/** `/api/aircraft-types`: every role reads; administrators write. */
export function aircraftTypesRoutes(): Router {
  const router = Router();
  router.get('/', requireCapability('read-published'), async (req, res) => {
    res.json({ aircraftTypes: await fleet.listAircraftTypes(operatorScope(req)) });
  });
  router.get('/:id', requireCapability('read-published'), async (req, res) => {
    res.json({ aircraftType: await fleet.getAircraftType(operatorScope(req), idParam(req.params['id'], 'That aircraft type')) });
  });
  router.post('/', requireCapability('manage-fleet'), async (req, res) => {
    const input = parseOrThrow(createAircraftTypeSchema, req.body, 'aircraft type');
    res.status(201).json({ aircraftType: await fleet.createAircraftType(actorOf(req), input) });
  });
  router.patch('/:id', requireCapability('manage-fleet'), async (req, res) => {
    const id = idParam(req.params['id'], 'That aircraft type');
    const input = parseOrThrow(updateAircraftTypeSchema, req.body, 'aircraft type');
    res.json({ aircraftType: await fleet.updateAircraftType(actorOf(req), id, input) });
  });
  return router;
}

/** `/api/airframes`: every role reads; administrators write. */
export function airframesRoutes(): Router {
  const router = Router();
  router.get('/', requireCapability('read-published'), async (req, res) => {
    res.json({ airframes: await fleet.listAirframes(operatorScope(req)) });
  });
  router.get('/:id', requireCapability('read-published'), async (req, res) => {
    res.json({ airframe: await fleet.getAirframe(operatorScope(req), idParam(req.params['id'], 'That airframe')) });
  });
  router.post('/', requireCapability('manage-fleet'), async (req, res) => {
    const input = parseOrThrow(createAirframeSchema, req.body, 'airframe');
    res.status(201).json({ airframe: await fleet.createAirframe(actorOf(req), input) });
  });
  router.patch('/:id', requireCapability('manage-fleet'), async (req, res) => {
    const id = idParam(req.params['id'], 'That airframe');
    const input = parseOrThrow(updateAirframeSchema, req.body, 'airframe');
    res.json({ airframe: await fleet.updateAirframe(actorOf(req), id, input) });
  });
  return router;
}
