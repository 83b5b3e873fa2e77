/**
 * Security headers on every response (helmet): a Content-Security-Policy that allows scripts,
 * module workers, styles, fonts and images from this server only, forbids framing
 * (frame-ancestors 'none' and X-Frame-Options DENY), Referrer-Policy
 * strict-origin-when-cross-origin and X-Content-Type-Options nosniff. Styles also allow
 * 'unsafe-inline' because the charts and React set `style` attributes; no inline script is
 * allowed anywhere. The built app is checked against this policy in Chromium
 * (tests/e2e/csp.e2e.ts): no violation on sign-in, designer, review and field check.
 */
import type { RequestHandler } from "express";
import helmet from "helmet";

export const CONTENT_SECURITY_POLICY = {
  "default-src": ["'self'"],
  "script-src": ["'self'"],
  "worker-src": ["'self'"],
  "style-src": ["'self'", "'unsafe-inline'"],
  "font-src": ["'self'"],
  "img-src": ["'self'", "data:", "blob:"],
  "connect-src": ["'self'"],
  "object-src": ["'none'"],
  "base-uri": ["'self'"],
  "form-action": ["'self'"],
  "frame-ancestors": ["'none'"],
  "manifest-src": ["'self'"],
} as const;

export function securityHeaders(): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: Object.fromEntries(
        Object.entries(CONTENT_SECURITY_POLICY).map(([k, v]) => [k, [...v]]),
      ),
    },
    frameguard: { action: "deny" },
    referrerPolicy: { policy: "strict-origin-when-cross-origin" },
    // Plain-HTTP installs (a laptop in the field) must keep working: HSTS only says something
    // when the server is reached over HTTPS, where browsers honour it.
    strictTransportSecurity: { maxAge: 15552000, includeSubDomains: false },
    crossOriginEmbedderPolicy: false,
  });
}
