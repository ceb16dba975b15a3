/**
 * Every URL the client uses: the pages (with their router patterns) and the API endpoints.
 * Nothing else in src/ writes a URL by hand.
 */
import { env } from './env';

const seg = (value: string) => encodeURIComponent(value);

/**
 * A redirect target is only honoured when it is a path on this site ("/benches/…"), never
 * another origin ("//host", "https://…") — otherwise sign-in would be an open redirect.
 */
export function safeRedirectTarget(value: string | null | undefined, fallback = '/benches'): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return fallback;
  if (value.startsWith('/sign-in') || value.startsWith('/sign-up')) return fallback;
  return value;
}

function withRedirect(base: string, redirectTo?: string | null): string {
  if (!redirectTo) return base;
  const target = safeRedirectTarget(redirectTo, '');
  return target ? `${base}?redirectTo=${encodeURIComponent(target)}` : base;
}

export const paths = {
  home: { path: '/', getHref: () => '/' },
  auth: {
    signIn: { path: '/sign-in', getHref: (redirectTo?: string | null) => withRedirect('/sign-in', redirectTo) },
    signUp: { path: '/sign-up', getHref: (redirectTo?: string | null) => withRedirect('/sign-up', redirectTo) },
    forgotPassword: { path: '/forgot-password', getHref: () => '/forgot-password' },
    resetPassword: { path: '/reset-password/:token', getHref: (token: string) => `/reset-password/${seg(token)}` },
  },
  benches: {
    list: { path: '/benches', getHref: () => '/benches' },
    home: { path: '/benches/:benchId', getHref: (benchId: string) => `/benches/${seg(benchId)}` },
    members: {
      path: '/benches/:benchId/members',
      getHref: (benchId: string) => `/benches/${seg(benchId)}/members`,
    },
    /** add a capture; `laserId` preselects the laser */
    upload: {
      path: '/benches/:benchId/captures/new',
      getHref: (benchId: string, laserId?: string) =>
        `/benches/${seg(benchId)}/captures/new${laserId ? `?laser=${encodeURIComponent(laserId)}` : ''}`,
    },
    /** one analysis of a capture: its spectrum, figures and settings */
    spectrum: {
      path: '/benches/:benchId/spectra/:analysisId',
      getHref: (benchId: string, analysisId: string) => `/benches/${seg(benchId)}/spectra/${seg(analysisId)}`,
    },
    /** RF beat spectra on the bench: the list and the upload form */
    rfSpectra: { path: '/benches/:benchId/rf-spectra', getHref: (benchId: string) => `/benches/${seg(benchId)}/rf-spectra` },
    /** one RF beat spectrum with its fits */
    rfSpectrum: {
      path: '/benches/:benchId/rf-spectra/:rfSpectrumId',
      getHref: (benchId: string, id: string) => `/benches/${seg(benchId)}/rf-spectra/${seg(id)}`,
    },
    /** the printable report of an overlay: figures side by side, plot, marks, provenance */
    overlayReport: {
      path: '/benches/:benchId/overlays/:overlayId/report',
      getHref: (benchId: string, overlayId: string) => `/benches/${seg(benchId)}/overlays/${seg(overlayId)}/report`,
    },
    /** the printable report of one analysis: figures, plot, marks, provenance */
    report: {
      path: '/benches/:benchId/spectra/:analysisId/report',
      getHref: (benchId: string, analysisId: string) => `/benches/${seg(benchId)}/spectra/${seg(analysisId)}/report`,
    },
    /** a laser and its spectra over time */
    laser: {
      path: '/benches/:benchId/lasers/:laserId',
      getHref: (benchId: string, laserId: string) => `/benches/${seg(benchId)}/lasers/${seg(laserId)}`,
    },
    /** a laser's predicted linewidth (the estimator) beside its measured sweep against output power */
    laserModel: {
      path: '/benches/:benchId/lasers/:laserId/model',
      getHref: (benchId: string, laserId: string) => `/benches/${seg(benchId)}/lasers/${seg(laserId)}/model`,
    },
    /** coherent-link phase-noise budgets: evaluate, and the bench's saved ones */
    linkBudgets: { path: '/benches/:benchId/link-budgets', getHref: (benchId: string) => `/benches/${seg(benchId)}/link-budgets` },
    /** rate-equation simulations that write synthetic captures onto the bench */
    simulations: { path: '/benches/:benchId/simulations', getHref: (benchId: string) => `/benches/${seg(benchId)}/simulations` },
    /** a laser's linewidths against an operating parameter */
    sweep: {
      path: '/benches/:benchId/lasers/:laserId/sweep',
      getHref: (benchId: string, laserId: string, parameter?: string) =>
        `/benches/${seg(benchId)}/lasers/${seg(laserId)}/sweep${parameter ? `?parameter=${encodeURIComponent(parameter)}` : ''}`,
    },
    /** the bench's overlays; `add` offers that analysis for a new or existing overlay */
    overlays: {
      path: '/benches/:benchId/overlays',
      getHref: (benchId: string, add?: string) => `/benches/${seg(benchId)}/overlays${add ? `?add=${encodeURIComponent(add)}` : ''}`,
    },
    overlay: {
      path: '/benches/:benchId/overlays/:overlayId',
      getHref: (benchId: string, overlayId: string) => `/benches/${seg(benchId)}/overlays/${seg(overlayId)}`,
    },
  },
  account: { path: '/account', getHref: () => '/account' },
  /** the link in an invitation e-mail */
  invitation: { path: '/invitation/:token', getHref: (token: string) => `/invitation/${seg(token)}` },
  /** e-mail caught by the local mail catcher (development and test) */
  outbox: { path: '/outbox', getHref: () => '/outbox' },
  /** a bench's audit trail (owners) */
  audit: { path: '/benches/:benchId/audit', getHref: (benchId: string) => `/benches/${seg(benchId)}/audit` },
  /** a share link's public page (no sign-in) */
  shared: { path: '/shared/:token', getHref: (token: string) => `/shared/${seg(token)}` },
} as const;

const api = env.apiBase;

/**
 * "?a=1&b=x" from an object's defined, non-empty values (in the object's key order); "" when none.
 * Takes any object so feature filter interfaces pass as they are.
 */
export function queryString(query?: object): string {
  if (!query) return '';
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '') continue;
    params.set(key, String(value));
  }
  const text = params.toString();
  return text ? `?${text}` : '';
}

export const apiPaths = {
  auth: {
    signUp: () => `${api}/auth/sign-up`,
    signIn: () => `${api}/auth/sign-in`,
    signOut: () => `${api}/auth/sign-out`,
  },
  me: () => `${api}/me`,
  outbox: () => `${api}/outbox`,
  notificationSettings: () => `${api}/notification-settings`,
  invitations: {
    /** GET (owner) the bench's invitations; POST to invite */
    ofBench: (benchId: string) => `${api}/benches/${seg(benchId)}/invitations`,
    preview: () => `${api}/invitations/preview`,
    accept: () => `${api}/invitations/accept`,
  },
  passwordResets: {
    request: () => `${api}/password-resets`,
    check: () => `${api}/password-resets/check`,
    confirm: () => `${api}/password-resets/confirm`,
  },
  /** GET with ?action=&actorId=&from=&to=&limit=&before= */
  audit: (benchId: string, query?: object) => `${api}/benches/${seg(benchId)}/audit${queryString(query)}`,
  /** personal API tokens: GET lists, POST makes one; DELETE …/:tokenId revokes */
  apiTokens: {
    list: () => `${api}/me/tokens`,
    detail: (tokenId: string) => `${api}/me/tokens/${seg(tokenId)}`,
  },
  benches: {
    list: () => `${api}/benches`,
    detail: (benchId: string) => `${api}/benches/${seg(benchId)}`,
    members: (benchId: string) => `${api}/benches/${seg(benchId)}/members`,
    member: (benchId: string, userId: string) => `${api}/benches/${seg(benchId)}/members/${seg(userId)}`,
    lasers: (benchId: string) => `${api}/benches/${seg(benchId)}/lasers`,
    laser: (benchId: string, laserId: string) => `${api}/benches/${seg(benchId)}/lasers/${seg(laserId)}`,
    /** GET with ?laserId=&kind=&tag=&page=&pageSize=; POST multipart to upload */
    captures: (benchId: string, query?: object) => `${api}/benches/${seg(benchId)}/captures${queryString(query)}`,
    rfSpectra: (benchId: string) => `${api}/benches/${seg(benchId)}/rf-spectra`,
    laserSpectra: (benchId: string, laserId: string) =>
      `${api}/benches/${seg(benchId)}/lasers/${seg(laserId)}/spectra`,
    sweep: (benchId: string, laserId: string, parameter: string) =>
      `${api}/benches/${seg(benchId)}/lasers/${seg(laserId)}/sweep${queryString({ parameter })}`,
    overlays: (benchId: string) => `${api}/benches/${seg(benchId)}/overlays`,
    linkBudgets: (benchId: string) => `${api}/benches/${seg(benchId)}/link-budgets`,
    simulations: (benchId: string) => `${api}/benches/${seg(benchId)}/simulations`,
    shareLinks: (benchId: string) => `${api}/benches/${seg(benchId)}/share-links`,
  },
  linkBudgets: {
    evaluate: () => `${api}/link-budgets/evaluate`,
    detail: (budgetId: string) => `${api}/link-budgets/${seg(budgetId)}`,
  },
  laserEstimates: () => `${api}/laser-estimates`,
  simulations: { detail: (simulationId: string) => `${api}/simulations/${seg(simulationId)}` },
  captures: {
    detail: (captureId: string) => `${api}/captures/${seg(captureId)}`,
    analyses: (captureId: string) => `${api}/captures/${seg(captureId)}/analyses`,
    marks: (captureId: string) => `${api}/captures/${seg(captureId)}/marks`,
    comments: (captureId: string) => `${api}/captures/${seg(captureId)}/comments`,
  },
  marks: { detail: (markId: string) => `${api}/marks/${seg(markId)}` },
  comments: { detail: (commentId: string) => `${api}/comments/${seg(commentId)}` },
  version: () => `${api}/version`,
  analyses: {
    detail: (analysisId: string) => `${api}/analyses/${seg(analysisId)}`,
    /** GET with ?view=&points= */
    spectrum: (analysisId: string, query?: object) => `${api}/analyses/${seg(analysisId)}/spectrum${queryString(query)}`,
    seriesCsv: (analysisId: string) => `${api}/analyses/${seg(analysisId)}/series.csv`,
    retry: (analysisId: string) => `${api}/analyses/${seg(analysisId)}/retry`,
    shareLinks: (analysisId: string) => `${api}/analyses/${seg(analysisId)}/share-links`,
    allan: (analysisId: string) => `${api}/analyses/${seg(analysisId)}/allan`,
    corrections: (analysisId: string) => `${api}/analyses/${seg(analysisId)}/corrections`,
  },
  rfSpectra: {
    detail: (id: string) => `${api}/rf-spectra/${seg(id)}`,
  },
  corrections: {
    detail: (id: string) => `${api}/corrections/${seg(id)}`,
  },
  overlays: {
    detail: (overlayId: string) => `${api}/overlays/${seg(overlayId)}`,
    shareLinks: (overlayId: string) => `${api}/overlays/${seg(overlayId)}/share-links`,
  },
  shareLinks: { detail: (linkId: string) => `${api}/share-links/${seg(linkId)}` },
  shared: (token: string) => `${api}/shared/${seg(token)}`,
} as const;
