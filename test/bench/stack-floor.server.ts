/**
 * The floor of the fixed stack, for the load benchmark (load.bench.ts starts it; not part of the app):
 * Express 5 with helmet and express-session (a memory store holding one signed-in session, rolling
 * cookie, as the api sets it up), answering `GET /floor` with a small JSON object. No Nest, no
 * database. Whatever the api does on top costs more than this; on a machine where this alone cannot
 * hold the target, no route of the api can.
 *   PORT=4198 npx tsx test/bench/stack-floor.server.ts   (prints the session cookie, then serves)
 */
import express from 'express';
import session from 'express-session';
import helmet from 'helmet';

const SECRET = 'stack-floor-secret-not-a-real-one-0123456789';
const store = new session.MemoryStore();
const app = express();
app.disable('x-powered-by');
app.use(helmet());
app.use(
  session({
    name: 'floor_sid',
    secret: SECRET,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', maxAge: 14 * 86_400_000, path: '/' },
  }),
);
app.get('/sign-in', (req, res) => {
  (req.session as unknown as { user: number }).user = 1;
  res.json({ ok: true });
});
app.get('/floor', (req, res) => {
  res.json({ user: (req.session as unknown as { user?: number }).user ?? null, name: 'Floor', isAdmin: false });
});
const port = Number(process.env.PORT ?? 4198);
app.listen(port, '127.0.0.1', () => process.stdout.write(`listening ${port}\n`));
