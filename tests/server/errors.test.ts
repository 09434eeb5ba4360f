import express from 'express';
import { UniqueConstraintError } from 'sequelize';
import request from 'supertest';
import { expect, test } from 'vitest';
import { errorHandler } from '../../server/errors';

test('a unique-key clash from any route leaves as 409 ALREADY_EXISTS with a plain message, not 500', async () => {
  const app = express();
  app.post('/thing', () => {
    throw new UniqueConstraintError({ message: 'Validation error' });
  });
  app.use(errorHandler);
  const res = await request(app).post('/thing');
  expect(res.status).toBe(409);
  expect(res.body).toEqual({ error: { code: 'ALREADY_EXISTS', message: expect.stringMatching(/already saved.*Reload/) } });
});
