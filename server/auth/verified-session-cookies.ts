import { createRequire } from 'node:module';

type Unsign = (value: string, secret: unknown) => string | false;
interface CookieSignature {
  unsign: Unsign;
}

const remembering = Symbol('halflight.rememberedSessionCookies');

/** Verified cookies kept per process (of every secret together); when full, it starts empty again. */
export const rememberedCookieLimit = 10_000;

/**
 * The cookie-signature module that express-session itself requires (its own copy, 1.0 at present,
 * nested under express-session): the one whose `unsign` it calls for every request's cookie.
 */
export function expressSessionCookieSignature(): CookieSignature & { [remembering]?: true } {
  const fromHere = createRequire(import.meta.url);
  return createRequire(fromHere.resolve('express-session'))('cookie-signature') as CookieSignature;
}

/**
 * express-session checks the signature of the session cookie on every request (index.js,
 * getcookie, through cookie-signature's unsign): an HMAC-SHA256 of the session id and two SHA-1s
 * to compare it with the signature sent, about 1.5 % of node time in the read-mix profile of
 * bench:load. A signed value and a secret always give the same answer, so a value this process
 * has verified once under a secret is taken as verified the next time it comes with that secret.
 * Only values whose signature was right are kept, keyed by the whole signed text (id and
 * signature) and by the secret, so a changed signature, another secret (another app in the same
 * process) or a value never verified goes through the HMAC as before. At most
 * `rememberedCookieLimit` values are kept; a sign-out or an expiry is still found by the session
 * store, as before.
 *
 * Wraps the `unsign` export of express-session's own copy of cookie-signature (express-session
 * looks it up on the module at each call); done once per process, whatever number of apps.
 */
export function rememberVerifiedSessionCookies(): void {
  const signature = expressSessionCookieSignature();
  if (signature[remembering]) return;
  const unsign = signature.unsign;
  const verified = new Map<unknown, Map<string, string>>();
  let kept = 0;
  signature.unsign = (value, secret) => {
    const known = verified.get(secret)?.get(value);
    if (known !== undefined) return known;
    const result = unsign(value, secret);
    if (result === false || typeof value !== 'string') return result;
    if (kept >= rememberedCookieLimit) {
      verified.clear();
      kept = 0;
    }
    let ofSecret = verified.get(secret);
    if (!ofSecret) verified.set(secret, (ofSecret = new Map()));
    ofSecret.set(value, result);
    kept += 1;
    return result;
  };
  signature[remembering] = true;
}
