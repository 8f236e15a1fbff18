// Express 5's floor: one route answering a short JSON body, no middleware.
import type { AddressInfo } from 'node:net';
import express from 'express';

const app = express();
app.get('/', (_req, res) => {
  res.json({ hello: 'world' });
});
const server = app.listen(0, '127.0.0.1', () => process.send!({ port: (server.address() as AddressInfo).port }));
