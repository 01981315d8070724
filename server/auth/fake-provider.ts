import crypto from 'node:crypto';
import { Router, type Request } from 'express';
import { setupServer } from 'msw/node';
import { http, HttpResponse } from 'msw';
import { and, asc, eq, like } from 'drizzle-orm';
import type { Db } from '../db/client';
import { shops, users } from '../db/schema/users';
import type { Config } from '../config';
import { roleLabels, type Role } from '../../shared/roles';

/**
 * The local stand-in for the sign-in provider. The real strategy runs unchanged: its browser
 * redirect lands on our own authorize page, and its server-side token and profile requests
 * are answered in-process by msw with the provider's own success and error answers.
 */

export const providerUrls = {
  token: 'https://github.com/login/oauth/access_token',
  profile: 'https://api.github.com/user',
  emails: 'https://api.github.com/user/emails',
};

export const demoProviderPrefix = 'demo-';
export const loginPattern = /^[A-Za-z0-9](?:[A-Za-z0-9_-]{0,38})$/;

type Identity = { id: string; login: string; name: string; email: string; avatarUrl: string | null };
type Grant = { identity: Identity; clientId: string; clientSecret: string; redirectUri: string; expiresAt: number };

const codeLifetimeMs = 10 * 60 * 1000;
const tokenLifetimeMs = 60 * 60 * 1000;

// msw answers for the whole process, so what it knows is process-wide too
const grants = new Map<string, Grant>();
const tokens = new Map<string, { identity: Identity; expiresAt: number }>();

function prune(now = Date.now()) {
  for (const [code, g] of grants) if (g.expiresAt <= now) grants.delete(code);
  for (const [token, t] of tokens) if (t.expiresAt <= now) tokens.delete(token);
}

function issueCode(grant: Omit<Grant, 'expiresAt'>): string {
  prune();
  const code = crypto.randomBytes(10).toString('hex');
  grants.set(code, { ...grant, expiresAt: Date.now() + codeLifetimeMs });
  return code;
}

const tokenErrors = {
  bad_verification_code: 'The code passed is incorrect or expired.',
  incorrect_client_credentials: 'The client_id and/or client_secret passed are incorrect.',
  redirect_uri_mismatch: 'The redirect_uri MUST match the registered callback URL for this application.',
} as const;

/** The provider answers form-encoded unless JSON is asked for, errors included (with status 200). */
function tokenAnswer(request: globalThis.Request, body: Record<string, string>) {
  const accept = request.headers.get('accept') ?? '';
  if (accept.includes('application/json')) return HttpResponse.json(body);
  return new HttpResponse(new URLSearchParams(body).toString(), {
    headers: { 'content-type': 'application/x-www-form-urlencoded; charset=utf-8' },
  });
}

function tokenError(request: globalThis.Request, error: keyof typeof tokenErrors) {
  return tokenAnswer(request, {
    error,
    error_description: tokenErrors[error],
    error_uri: 'https://docs.github.com/apps/managing-oauth-apps/troubleshooting-oauth-app-access-token-request-errors',
  });
}

function bearer(request: globalThis.Request) {
  const header = request.headers.get('authorization') ?? '';
  const match = /^(?:bearer|token)\s+(\S+)$/i.exec(header);
  const entry = match ? tokens.get(match[1]) : undefined;
  return entry && entry.expiresAt > Date.now() ? entry.identity : null;
}

const badCredentials = () =>
  HttpResponse.json(
    { message: 'Bad credentials', documentation_url: 'https://docs.github.com/rest', status: '401' },
    { status: 401 },
  );

export const fakeProviderHandlers = [
  http.post(providerUrls.token, async ({ request }) => {
    const form = new URLSearchParams(await request.text());
    const code = form.get('code') ?? '';
    const grant = grants.get(code);
    if (!grant || grant.expiresAt <= Date.now()) return tokenError(request, 'bad_verification_code');
    grants.delete(code);
    if (form.get('client_id') !== grant.clientId || form.get('client_secret') !== grant.clientSecret) {
      return tokenError(request, 'incorrect_client_credentials');
    }
    const redirectUri = form.get('redirect_uri');
    if (redirectUri && redirectUri !== grant.redirectUri) return tokenError(request, 'redirect_uri_mismatch');
    const token = crypto.randomBytes(20).toString('hex');
    tokens.set(token, { identity: grant.identity, expiresAt: Date.now() + tokenLifetimeMs });
    return tokenAnswer(request, { access_token: token, scope: 'user:email', token_type: 'bearer' });
  }),
  http.get(providerUrls.profile, ({ request }) => {
    const who = bearer(request);
    if (!who) return badCredentials();
    return HttpResponse.json({
      login: who.login,
      id: who.id,
      avatar_url: who.avatarUrl,
      html_url: null,
      type: 'User',
      name: who.name || null,
      email: null,
    });
  }),
  http.get(providerUrls.emails, ({ request }) => {
    const who = bearer(request);
    if (!who) return badCredentials();
    return HttpResponse.json([{ email: who.email, primary: true, verified: true, visibility: 'private' }]);
  }),
];

let server: ReturnType<typeof setupServer> | null = null;

/** Starts answering the provider's server-side requests; once per process, however many apps start. */
export function startFakeProvider() {
  if (server) return;
  server = setupServer(...fakeProviderHandlers);
  // it also sees loopback traffic (tests, the app talking to itself): let everything else through
  server.listen({ onUnhandledRequest: 'bypass' });
}

// --- the authorize page ---

type DemoAccount = {
  login: string;
  name: string;
  role: Role;
  providerId: string;
  email: string | null;
  avatarUrl: string | null;
  shop: string | null;
  suspended: boolean;
};

function demoAccounts(db: Db): DemoAccount[] {
  return db
    .select({
      login: users.login,
      name: users.name,
      role: users.role,
      providerId: users.providerId,
      email: users.email,
      avatarUrl: users.avatarUrl,
      shop: shops.name,
      suspendedAt: users.suspendedAt,
    })
    .from(users)
    .leftJoin(shops, eq(shops.id, users.shopId))
    .where(and(eq(users.provider, 'github'), like(users.providerId, `${demoProviderPrefix}%`)))
    .orderBy(asc(users.login))
    .all()
    .map(({ suspendedAt, ...a }) => ({ ...a, suspended: suspendedAt !== null }));
}

const esc = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const palette = {
  ink: '#1d4d3a',
  inkFaint: '#dbe7e0',
  brass: '#b8892f',
  brassSoft: '#e9d7ad',
  brassDeep: '#7a5a1c',
  paper: '#f7f4ec',
  card: '#fffdf8',
  oxide: '#a4372a',
  oxideSoft: '#f6e1dc',
  graphite: '#2b2b28',
  soft: '#5c5a52',
};

const styles = `
*{box-sizing:border-box}
body{margin:0;background:${palette.paper};color:${palette.graphite};font-family:"Nunito Sans",system-ui,sans-serif;line-height:1.5}
header{background:${palette.ink};color:${palette.paper};padding:14px 20px;font-weight:800;font-size:18px}
header span{color:${palette.brass}}
main{max-width:560px;margin:0 auto;padding:24px 16px 48px}
h1{color:${palette.ink};font-size:24px;margin:0 0 6px;font-weight:800}
p.lead{color:${palette.soft};margin:0 0 20px}
ul{list-style:none;margin:0;padding:0;display:grid;gap:10px}
a.account{display:flex;align-items:center;gap:12px;padding:12px 14px;background:${palette.card};border:1px solid rgba(43,43,40,.15);border-radius:10px;color:inherit;text-decoration:none;min-height:56px}
a.account:hover,a.account:focus-visible{border-color:${palette.ink};outline:2px solid ${palette.brass};outline-offset:2px}
.initials{flex:none;width:38px;height:38px;border-radius:50%;background:${palette.inkFaint};color:${palette.ink};display:grid;place-items:center;font-weight:800}
.who{flex:1;min-width:0}.who b{display:block}.who small{color:${palette.soft}}
.badge{font-size:12px;font-weight:700;border-radius:999px;padding:2px 10px;background:${palette.brassSoft};color:${palette.brassDeep};white-space:nowrap}
.badge.off{background:${palette.oxideSoft};color:${palette.oxide}}
form{margin-top:24px;padding:16px;background:${palette.card};border:1px dashed rgba(43,43,40,.3);border-radius:10px}
label{font-weight:700;display:block;margin-bottom:6px}
.row{display:flex;gap:8px;flex-wrap:wrap}
input[type=text]{flex:1;min-width:180px;font:inherit;padding:8px 10px;border:1px solid rgba(43,43,40,.3);border-radius:6px;background:#fff}
button{font:inherit;font-weight:700;padding:8px 16px;border-radius:6px;border:0;background:${palette.ink};color:${palette.paper};cursor:pointer}
.hint{font-size:13px;color:${palette.soft};margin:6px 0 0}
.error{background:${palette.oxideSoft};color:${palette.oxide};border-left:4px solid ${palette.oxide};padding:10px 12px;border-radius:6px;margin-bottom:16px;font-weight:600}
.cancel{display:inline-block;margin-top:20px;color:${palette.ink};font-weight:700}
`;

function page(title: string, body: string) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1"><title>${esc(title)} · Swapyard</title><link rel="icon" href="data:,"><style>${styles}</style></head><body><header>Swap<span>yard</span> · local sign-in</header><main>${body}</main></body></html>`;
}

const initials = (a: { name: string; login: string }) =>
  (a.name || a.login)
    .split(/[\s_-]+/)
    .filter(Boolean)
    .slice(0, 2)
    .map((w) => w[0]!.toUpperCase())
    .join('');

type AuthorizeParams = { clientId: string; redirectUri: string; state: string; scope: string };

/** The callback must be this very server's; anything else would make the fake page an open redirect. */
function checkParams(req: Request, config: Config): AuthorizeParams | string {
  const q = req.query;
  const str = (v: unknown) => (typeof v === 'string' ? v : '');
  const clientId = str(q.client_id);
  const redirectUri = str(q.redirect_uri);
  const state = str(q.state);
  if (str(q.response_type) !== 'code') return 'The sign-in request is missing response_type=code.';
  if (clientId !== config.auth.clientId) return 'The sign-in request names an unknown application.';
  if (!state) return 'The sign-in request carries no state; start again from the Sign in link.';
  let target: URL;
  try {
    target = new URL(redirectUri);
  } catch {
    return 'The sign-in request has no valid return address.';
  }
  if (target.host !== req.get('host') || target.pathname !== '/auth/github/callback' || target.search) {
    return 'The sign-in request asks to return to another address; only this server may receive the answer.';
  }
  return { clientId, redirectUri, state, scope: str(q.scope) };
}

export function fakeAuthorizeRouter({ db, config }: { db: Db; config: Config }) {
  const router = Router();
  router.get('/authorize', (req, res) => {
    res.set('Cache-Control', 'no-store');
    const params = checkParams(req, config);
    if (typeof params === 'string') {
      res
        .status(400)
        .type('html')
        .send(
          page(
            'Sign-in request refused',
            `<h1>Sign-in request refused</h1><div class="error" role="alert">${esc(params)}</div><a class="cancel" href="/">Back to Swapyard</a>`,
          ),
        );
      return;
    }
    const back = (extra: Record<string, string>) => {
      const url = new URL(params.redirectUri);
      for (const [k, v] of Object.entries({ ...extra, state: params.state })) url.searchParams.set(k, v);
      return url.toString();
    };
    const accounts = demoAccounts(db);
    const login = typeof req.query.login === 'string' ? req.query.login.trim() : '';
    let problem = '';
    if (login) {
      if (!loginPattern.test(login)) {
        problem = 'A login is 1–39 letters, digits, dashes or underscores, starting with a letter or digit.';
      } else {
        const known = accounts.find((a) => a.login.toLowerCase() === login.toLowerCase());
        const identity: Identity = known
          ? {
              id: known.providerId,
              login: known.login,
              name: known.name,
              email: known.email ?? `${known.login}@members.swapyard.invalid`,
              avatarUrl: known.avatarUrl,
            }
          : {
              id: `${demoProviderPrefix}${login.toLowerCase()}`,
              login,
              name: '',
              email: `${login.toLowerCase()}@members.swapyard.invalid`,
              avatarUrl: null,
            };
        const code = issueCode({
          identity,
          clientId: params.clientId,
          clientSecret: config.auth.clientSecret,
          redirectUri: params.redirectUri,
        });
        res.redirect(302, back({ code }));
        return;
      }
    }
    const choose = (name: string) => {
      const url = new URL(req.originalUrl, 'http://local');
      url.searchParams.set('login', name);
      return url.pathname + url.search;
    };
    const list = accounts.length
      ? `<ul>${accounts
          .map(
            (a) =>
              `<li><a class="account" href="${esc(choose(a.login))}"><span class="initials" aria-hidden="true">${esc(initials(a))}</span><span class="who"><b>${esc(a.name || a.login)}</b><small>@${esc(a.login)}${a.shop ? ` · ${esc(a.shop)}` : ''}</small></span>${a.suspended ? '<span class="badge off">Suspended</span>' : ''}<span class="badge">${esc(roleLabels[a.role])}</span></a></li>`,
          )
          .join('')}</ul>`
      : '<p>No demo accounts are in this database yet. Sign in as a new member below.</p>';
    const hidden = ['response_type', 'client_id', 'redirect_uri', 'scope', 'state']
      .map((k) =>
        typeof req.query[k] === 'string' ? `<input type="hidden" name="${k}" value="${esc(req.query[k] as string)}">` : '',
      )
      .join('');
    const body = `<h1>Choose who signs in</h1>
<p class="lead">This server runs without a real sign-in provider, so you pick a demo account. Each one has its role, to try what members, shops, moderators and admins see.</p>
${problem ? `<div class="error" role="alert">${esc(problem)}</div>` : ''}
${list}
<form method="get" action="/auth/fake/authorize">${hidden}
<label for="login">Or sign in as a new member</label>
<div class="row"><input type="text" id="login" name="login" required maxlength="39" pattern="[A-Za-z0-9][A-Za-z0-9_\\-]{0,38}" autocomplete="off" placeholder="a login, e.g. lugnut_lee" value="${esc(problem ? login : '')}"><button type="submit">Sign in</button></div>
<p class="hint">A new login becomes a member account the first time it signs in.</p>
</form>
<a class="cancel" href="${esc(back({ error: 'access_denied', error_description: 'The sign-in was cancelled.' }))}">Cancel and go back</a>`;
    res
      .status(problem ? 400 : 200)
      .type('html')
      .send(page('Choose who signs in', body));
  });
  return router;
}
