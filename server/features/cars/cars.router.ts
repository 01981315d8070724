import { Router } from 'express';
import { z } from 'zod';
import type { AppDeps } from '../../app';
import { validated } from '../../middleware/validate';
import { requireUser } from '../../middleware/require-role';
import { idParamSchema } from '../../../shared/schemas/params';
import { carInputSchema, carUpdateSchema, type CarList } from '../../../shared/schemas/cars';
import { createCar, deleteCar, listCars, updateCar } from './cars.service';

const idParams = z.object({ id: idParamSchema });

export function carsRouter({ db, clock }: AppDeps) {
  const router = Router();
  router.use('/cars', requireUser);

  router.get('/cars', (req, res) => {
    const body: CarList = { items: listCars(db, req.user!.id) };
    res.set('Cache-Control', 'private, no-store').json(body);
  });

  router.post(
    '/cars',
    validated({ body: carInputSchema }, ({ body }, req, res) => {
      res.status(201).json({ car: createCar(db, clock, req.user!.id, body) });
    }),
  );

  router.patch(
    '/cars/:id',
    validated({ params: idParams, body: carUpdateSchema }, ({ params, body }, req, res) => {
      res.json({ car: updateCar(db, clock, req.user!.id, params.id, body) });
    }),
  );

  router.delete(
    '/cars/:id',
    validated({ params: idParams }, ({ params }, req, res) => {
      deleteCar(db, req.user!.id, params.id);
      res.status(204).end();
    }),
  );

  return router;
}
