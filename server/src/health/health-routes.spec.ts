import express from 'express';
import request from 'supertest';
import type { Sequelize } from 'sequelize';
import { createHealthRoutes } from './health-routes';

const appWith = (query: () => Promise<unknown>, timeoutMs = 50) =>
  express().use('/health', createHealthRoutes({ query } as unknown as Sequelize, timeoutMs));

describe('health', () => {
  it('answers 200 when the database answers', async () => {
    const response = await request(appWith(() => Promise.resolve([]))).get('/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('answers 503 when the database refuses', async () => {
    const response = await request(appWith(() => Promise.reject(new Error('ECONNREFUSED')))).get('/health');
    expect(response.status).toBe(503);
  });

  it('answers 503 instead of hanging when the database never answers', async () => {
    const response = await request(appWith(() => new Promise(() => undefined))).get('/health');
    expect(response.status).toBe(503);
    expect(response.body.database).toBe('down');
  });
});
