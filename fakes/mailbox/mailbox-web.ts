import express, { type NextFunction, type Request, type Response } from 'express';
import { pageSecurityPolicy } from '../page-layout';
import { messageListPage, messagePage, notFoundPage } from './mailbox-pages';
import type { MessageStore } from './message-store';

/** The mailbox's page for people and its JSON API for scripts and tests. */
export function createMailboxWebApp(store: MessageStore, smtpAddress: string): express.Express {
  const app = express();
  app.disable('x-powered-by');
  app.use((_req, res, next) => {
    res.set('X-Content-Type-Options', 'nosniff');
    res.set('Cache-Control', 'no-store');
    next();
  });

  app.get('/health', (_req, res) => {
    res.json({ ok: true, messages: store.size });
  });

  app.get('/', (_req, res) => {
    sendHtml(res, 200, messageListPage(store.list(), smtpAddress));
  });

  app.get('/messages/:id', (req, res) => {
    const message = store.get(req.params['id'] ?? '');
    if (!message) {
      sendHtml(res, 404, notFoundPage());
      return;
    }
    sendHtml(res, 200, messagePage(message));
  });

  app.post('/clear', (_req, res) => {
    store.clear();
    res.redirect(303, '/');
  });

  app.get('/api/messages', (req, res) => {
    const to = req.query['to'];
    if (to !== undefined && typeof to !== 'string') {
      res.status(400).json({ error: 'Give at most one "to" address' });
      return;
    }
    res.json(store.list(to));
  });

  app.get('/api/messages/:id', (req, res) => {
    const message = store.get(req.params['id'] ?? '');
    if (!message) {
      res.status(404).json({ error: 'No such message' });
      return;
    }
    res.json(message);
  });

  app.delete('/api/messages', (_req, res) => {
    res.json({ cleared: store.clear() });
  });

  app.use((_req: Request, res: Response) => {
    res.status(404).json({ error: 'Not found' });
  });

  app.use((_error: unknown, _req: Request, res: Response, _next: NextFunction) => {
    res.status(500).json({ error: 'Server error' });
  });

  return app;
}

function sendHtml(res: Response, status: number, html: string): void {
  res.status(status).type('html').set('Content-Security-Policy', pageSecurityPolicy).send(html);
}
