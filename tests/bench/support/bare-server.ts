import express from 'express';

// The ceiling: the cheapest JSON route Express can serve on this machine.
const app = express();
app.get('/bare', (_req, res) => {
  res.json({ ok: true });
});
const server = app.listen(Number(process.env.PORT ?? 0), '127.0.0.1', () => {
  const address = server.address();
  console.log(`listening ${typeof address === 'object' && address ? address.port : ''}`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
