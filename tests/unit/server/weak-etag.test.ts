import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { weakEtag } from '../../../server/http/weak-etag';

/** An app answering each body as JSON, text or bytes, with the ETag function given (express's default when none). */
function appWith(etag?: typeof weakEtag) {
  const app = express();
  if (etag) app.set('etag', etag);
  app.get('/json/:i', (req, res) => res.json(bodies[Number(req.params.i)]));
  app.get('/text/:i', (req, res) => res.type('text/plain').send(String(bodies[Number(req.params.i)])));
  app.get('/bytes/:i', (req, res) => res.send(Buffer.from(JSON.stringify(bodies[Number(req.params.i)]))));
  return app;
}

// Invented bodies: empty, short, non-ASCII (multi-byte UTF-8) and one of about 40 kB.
const bodies: unknown[] = [
  '',
  { status: 'ok' },
  { name: 'Ru(bpy)₃²⁺ in MeCN — K_SV', τ0: 1.1e-6 },
  Array.from({ length: 600 }, (_, i) => ({ id: i, title: `Study ${i}`, kq: i * 1.5e9 })),
];

describe('weakEtag', () => {
  it.each(['json', 'text', 'bytes'])(
    'when a %s answer is sent, then its ETag is the one express makes by default',
    async (kind) => {
      // Reference: express 5's own default ETag (utils.wetag, the etag package) on the same answer.
      for (let i = 0; i < bodies.length; i++) {
        const expected = await request(appWith()).get(`/${kind}/${i}`);
        const actual = await request(appWith(weakEtag)).get(`/${kind}/${i}`);
        expect(expected.headers.etag).toMatch(/^W\/"[0-9a-f]+-[A-Za-z0-9+/]{27}"$/);
        expect(actual.headers.etag).toBe(expected.headers.etag);
      }
    },
  );

  it('when a string is given with its encoding, then the tag is that of its bytes', () => {
    // SHA-1 of no bytes: da39a3ee5e6b4b0d3255bfef95601890afd80709 (common practice), in base64
    // 2jmj7l5rSw0yVb/vlWAYkK/YBwk=; the etag package writes this same tag for an empty body.
    expect(weakEtag('')).toBe('W/"0-2jmj7l5rSw0yVb/vlWAYkK/YBwk"');
    expect(weakEtag('é', 'utf8')).toBe(weakEtag(Buffer.from('é', 'utf8')));
    expect(weakEtag('é', 'latin1')).toBe(weakEtag(Buffer.from([0xe9])));
  });
});
