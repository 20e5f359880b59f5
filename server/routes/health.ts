import type { Router } from 'express';
import type { Sequelize } from 'sequelize';

export function registerHealthRoutes(router: Router, sequelize: Sequelize) {
  // For a person or a monitor checking that the server and its database both answer.
  router.get('/api/health', async (_req, res) => {
    await sequelize.query('SELECT 1');
    res.json({ ok: true });
  });
}
