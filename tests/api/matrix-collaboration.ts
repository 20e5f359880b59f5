import { configFromEnv } from '../../server/config';
import { createMailer } from '../../server/mail/mailer';
import { Invitation, LibraryNotice, LibraryPin, PasswordReset, User } from '../../server/models';
import { libraryPublish, libraryRevise } from '../../server/services/library';
import { pinTake } from '../../server/services/library-pins';
import { mailTokenNew } from '../../server/services/mail-tokens';
import type { Camber } from '../../shared/geometry/camber-schema';
import type { MatrixFixture, MatrixRow } from './permission-matrix';
import { allCrew, crew, editors, everyone, signedInOnly, type Caller } from './matrix-statuses';
import { TEST_PASSWORD } from './support';

/**
 * Permission-matrix rows of the collaboration routes (invitations, password reset, account, Library,
 * pins, notices, the development mail page), spread into `matrix` in permission-matrix.ts. Rows whose
 * request needs something to exist first make it in `prepare`, fresh for every cell.
 */

/** An item the hull's designer wrote and shared with the hull's builder only: the author, someone who sees it, and everyone else. */
const authorOnly = (ok: number): Record<Caller, number> => ({ owner: 404, builder: 403, designer: ok, helper: 404, stranger: 404, anonymous: 401 });
const namedPeople = (ok: number): Record<Caller, number> => ({ owner: 404, builder: ok, designer: ok, helper: 404, stranger: 404, anonymous: 401 });

let counter = 0;
const freshEmail = () => `matrix-collab-${Date.now()}-${(counter += 1)}@example.test`;
const camber = (riseMm: number): Camber => ({ shape: 'parabola', points: [], crown: { kind: 'rise', riseMm, referenceBeamMm: 1860 }, convention: 'one-pattern' });
const mailing = () => ({ mailer: createMailer(configFromEnv(process.env).mail, 'silent'), linkBase: 'http://workshop.loftbench.test' });

const viewer = (f: MatrixFixture, who: Exclude<Caller, 'anonymous'>) => ({ id: f.people[who].id, email: f.people[who].email });

/** A camber the hull's designer publishes: shared with the builder, or public. */
async function designersCamber(f: MatrixFixture, visibility: 'shared' | 'public') {
  const item = await libraryPublish(viewer(f, 'designer'), { kind: 'camber', sharing: { visibility, shareWith: [f.people.builder.email] }, revision: { name: 'Matrix camber', document: camber(60) } });
  return { itemId: item.id, revisionId: item.latest.id };
}

/** The fixture hull takes a public camber in (as its owner), and the designer publishes a revision 2. */
async function pinnedWithNewer(f: MatrixFixture) {
  const { itemId, revisionId } = await designersCamber(f, 'public');
  const taken = await pinTake({ hullId: f.hullId, units: 'mm', role: 'owner', latestRevisionId: f.revisionId }, viewer(f, 'owner'), { itemId, revisionId, baseRevisionId: f.revisionId });
  const { revision } = await libraryRevise(viewer(f, 'designer'), itemId, { baseRevisionId: revisionId, name: 'Matrix camber', notes: '', rules: '', document: camber(70) }, mailing());
  return { pinId: taken.pin.id, planRevisionId: taken.revision.id, newRevisionId: revision.id };
}

async function pendingInvitation(f: MatrixFixture, email = freshEmail()) {
  const { token, hash } = mailTokenNew();
  const invitation = await Invitation.create({ hullId: f.hullId, email, role: 'helper', tokenHash: hash, invitedBy: f.people.owner.id, expiresAt: new Date(Date.now() + 3600_000) });
  return { token, invitationId: invitation.id };
}

async function spareResetToken(f: MatrixFixture) {
  const spare = (await User.findOne({ where: { email: f.spareEmail } }))!;
  const { token, hash } = mailTokenNew();
  await PasswordReset.create({ userId: spare.id, tokenHash: hash, expiresAt: new Date(Date.now() + 3600_000) });
  return { token };
}

const p = (f: MatrixFixture) => f.prepared as Record<string, number | string>;

export const collaborationMatrix: Record<string, MatrixRow> = {
  'GET /api/dev/mail': { path: () => '/api/dev/mail', expect: everyone(200) },

  'GET /api/hulls/:hullId/invitations': { path: (f) => `/api/hulls/${f.hullId}/invitations`, expect: crew(200, ['owner']) },
  'POST /api/hulls/:hullId/invitations': { path: (f) => `/api/hulls/${f.hullId}/invitations`, body: () => ({ email: freshEmail(), role: 'helper' }), expect: crew(201, ['owner']) },
  'DELETE /api/hulls/:hullId/invitations/:invitationId': {
    prepare: (f) => pendingInvitation(f),
    path: (f) => `/api/hulls/${f.hullId}/invitations/${p(f).invitationId}`,
    expect: crew(204, ['owner']),
  },
  'POST /api/invitations/preview': { prepare: (f) => pendingInvitation(f), path: () => '/api/invitations/preview', body: (f) => ({ token: p(f).token }), expect: everyone(200) },
  'POST /api/invitations/accept': {
    prepare: (f) => pendingInvitation(f),
    path: () => '/api/invitations/accept',
    // Signed in: the membership goes to the caller (crew members are on it already); signed out: a new account.
    body: (f) => (f.caller ? { token: p(f).token } : { token: p(f).token, newAccount: { displayName: 'Matrix newcomer', password: 'matrix password' } }),
    expect: { ...everyone(200), anonymous: 201 },
    freshSession: true,
  },

  'POST /api/account/password-reset': { path: () => '/api/account/password-reset', body: (f) => ({ email: f.spareEmail }), expect: everyone(202) },
  'POST /api/account/password-reset/preview': { prepare: spareResetToken, path: () => '/api/account/password-reset/preview', body: (f) => ({ token: p(f).token }), expect: everyone(200) },
  'POST /api/account/password-reset/complete': {
    prepare: spareResetToken,
    path: () => '/api/account/password-reset/complete',
    body: (f) => ({ token: p(f).token, password: 'a new spare password' }),
    expect: everyone(200),
  },
  'GET /api/account/settings': { path: () => '/api/account/settings', expect: signedInOnly(200) },
  'PUT /api/account/settings': { path: () => '/api/account/settings', body: () => ({ noticeMail: false }), expect: signedInOnly(200) },
  // The same password again, keeping the other sessions: the matrix's shared sessions must live on.
  'POST /api/account/password': { path: () => '/api/account/password', body: () => ({ currentPassword: TEST_PASSWORD, newPassword: TEST_PASSWORD, signOutOthers: false }), expect: signedInOnly(200) },

  'GET /api/library': { path: () => '/api/library', expect: signedInOnly(200) },
  'POST /api/library': {
    path: () => '/api/library',
    body: () => ({ kind: 'camber', sharing: { visibility: 'private' }, revision: { name: 'My camber', document: camber(50) } }),
    expect: signedInOnly(201),
  },
  'GET /api/library/:itemId': { prepare: (f) => designersCamber(f, 'shared'), path: (f) => `/api/library/${p(f).itemId}`, expect: namedPeople(200) },
  'PATCH /api/library/:itemId': {
    prepare: (f) => designersCamber(f, 'shared'),
    path: (f) => `/api/library/${p(f).itemId}`,
    body: (f) => ({ sharing: { visibility: 'shared', shareWith: [f.people.builder.email, f.people.helper.email] } }),
    expect: authorOnly(200),
  },
  'POST /api/library/:itemId/revisions': {
    prepare: (f) => designersCamber(f, 'shared'),
    path: (f) => `/api/library/${p(f).itemId}/revisions`,
    body: (f) => ({ baseRevisionId: p(f).revisionId, name: 'Matrix camber', document: camber(65) }),
    expect: authorOnly(201),
  },
  'GET /api/library/:itemId/revisions/:revisionId': {
    prepare: (f) => designersCamber(f, 'shared'),
    path: (f) => `/api/library/${p(f).itemId}/revisions/${p(f).revisionId}`,
    expect: namedPeople(200),
  },

  'GET /api/hulls/:hullId/pins': { path: (f) => `/api/hulls/${f.hullId}/pins`, expect: crew(200, allCrew) },
  'POST /api/hulls/:hullId/pins': {
    prepare: (f) => designersCamber(f, 'public'),
    path: (f) => `/api/hulls/${f.hullId}/pins`,
    body: (f) => ({ itemId: p(f).itemId, revisionId: p(f).revisionId, baseRevisionId: f.revisionId }),
    expect: crew(201, editors),
  },
  'GET /api/hulls/:hullId/pins/:pinId/compare': {
    prepare: pinnedWithNewer,
    path: (f) => `/api/hulls/${f.hullId}/pins/${p(f).pinId}/compare?to=${p(f).newRevisionId}`,
    expect: crew(200, allCrew),
  },
  'POST /api/hulls/:hullId/pins/:pinId/move': {
    prepare: pinnedWithNewer,
    path: (f) => `/api/hulls/${f.hullId}/pins/${p(f).pinId}/move`,
    body: (f) => ({ toRevisionId: p(f).newRevisionId, baseRevisionId: p(f).planRevisionId }),
    expect: crew(201, editors),
  },

  'GET /api/notices': { path: () => '/api/notices', expect: signedInOnly(200) },
  'POST /api/notices/:noticeId/dismiss': {
    // Everyone on the crew has a notice of their own; a stranger tries the owner's, which is not theirs.
    prepare: async (f) => {
      await pinnedWithNewer(f);
      const pin = (await LibraryPin.findOne({ where: { hullId: f.hullId } }))!;
      const whose = f.who === 'anonymous' || f.who === 'stranger' ? 'owner' : f.who;
      const notice = (await LibraryNotice.findOne({ where: { pinId: pin.id, userId: f.people[whose].id } }))!;
      return { noticeId: notice.id };
    },
    path: (f) => `/api/notices/${p(f).noticeId}/dismiss`,
    expect: { ...crew(204, allCrew), stranger: 404 },
  },
};
