/**
 * Share links: owners and analysts create a read-only link to a done spectrum (analysis) or an
 * overlay of their bench, optionally expiring, and revoke it; viewers are refused (403), members of
 * other benches see 404. The token is returned once inside the URL; only its sha256 is stored.
 * Creating and revoking are recorded in the bench's audit trail in the same transaction.
 */
import type { Knex } from 'knex';
import type { CreateShareLinkResponse, ShareLink, ShareLinkState } from '../../contracts/share-links';
import { conflict } from '../../errors';
import { newId } from '../../lib/ids';
import { findAnalysisForUser } from '../analyses/analyses.repository';
import { recordAudit } from '../audit/record-audit';
import type { BenchAccess } from '../benches/bench-policy';
import { accessFromRow, ANALYSIS_NOT_FOUND, assertCaptureAction, assertIdShape } from '../captures/capture-policy';
import type { OverlaysService } from '../overlays/overlays.service';
import { iso } from '../overlays/trace-rows';
import { findShareLinkForUser, insertShareLink, listShareLinks, revokeShareLink, type ShareLinkListRow } from './share-links.repository';
import { hashShareToken, newShareToken } from './share-token';

export const SHARE_LINK_NOT_FOUND = 'no such share link, or it is not on a bench of yours';

type ParsedCreate = { expiresAt?: string };

export function shareLinkState(row: { revoked_at: Date | null; expires_at: Date | null }, now = Date.now()): ShareLinkState {
  if (row.revoked_at) return 'revoked';
  if (row.expires_at && new Date(row.expires_at).getTime() <= now) return 'expired';
  return 'active';
}

function toShareLink(row: ShareLinkListRow): ShareLink {
  const kind = row.analysis_id ? 'analysis' : 'overlay';
  return {
    id: row.id,
    kind,
    targetId: (row.analysis_id ?? row.overlay_id) as string,
    targetLabel: (kind === 'analysis' ? row.file_name : row.overlay_name) ?? '',
    createdByName: row.created_by_name,
    createdAt: iso(row.created_at) as string,
    expiresAt: iso(row.expires_at),
    revokedAt: iso(row.revoked_at),
    state: shareLinkState(row),
  };
}

export function createShareLinksService(deps: { db: Knex; overlays: OverlaysService }) {
  const { db } = deps;

  async function create(
    access: BenchAccess,
    target: { analysisId: string } | { overlayId: string },
    input: ParsedCreate,
    publicBase: string,
  ): Promise<CreateShareLinkResponse> {
    const id = newId();
    const token = newShareToken();
    const expiresAt = input.expiresAt ? new Date(input.expiresAt) : null;
    const analysisId = 'analysisId' in target ? target.analysisId : null;
    const overlayId = 'overlayId' in target ? target.overlayId : null;
    await db.transaction(async (trx) => {
      await insertShareLink(trx, {
        id,
        bench_id: access.benchId,
        token_hash: hashShareToken(token),
        analysis_id: analysisId,
        overlay_id: overlayId,
        created_by: access.userId,
        created_at: new Date(),
        expires_at: expiresAt,
      });
      await recordAudit(trx, {
        benchId: access.benchId,
        actorId: access.userId,
        action: 'share_link.created',
        targetType: 'share_link',
        targetId: id,
        details: { ...(analysisId ? { analysisId } : { overlayId }), expiresAt: expiresAt?.toISOString() ?? null },
      });
    });
    return { id, url: `${publicBase.replace(/\/+$/, '')}/shared/${token}` };
  }

  return {
    async createForAnalysis(userId: string, analysisId: string, parse: () => ParsedCreate, publicBase: string): Promise<CreateShareLinkResponse> {
      assertIdShape(analysisId, ANALYSIS_NOT_FOUND);
      const row = await findAnalysisForUser(db, analysisId, userId, ['status'] as const);
      const access = accessFromRow(row, userId, ANALYSIS_NOT_FOUND);
      assertCaptureAction(access, 'captures.write');
      const input = parse();
      if (row!.status !== 'done') throw conflict(`this analysis is ${row!.status}; a spectrum can be shared once it is done`);
      return create(access, { analysisId }, input, publicBase);
    },

    async createForOverlay(userId: string, overlayId: string, parse: () => ParsedCreate, publicBase: string): Promise<CreateShareLinkResponse> {
      const { access } = await deps.overlays.accessTo(userId, overlayId);
      assertCaptureAction(access, 'captures.write');
      return create(access, { overlayId }, parse(), publicBase);
    },

    /** Revokes the link (again: no change, still 204). */
    async revoke(userId: string, linkId: string): Promise<void> {
      assertIdShape(linkId, SHARE_LINK_NOT_FOUND);
      const row = await findShareLinkForUser(db, linkId, userId);
      const access = accessFromRow(row, userId, SHARE_LINK_NOT_FOUND);
      assertCaptureAction(access, 'captures.write');
      await db.transaction(async (trx) => {
        if (await revokeShareLink(trx, linkId, userId)) {
          await recordAudit(trx, {
            benchId: access.benchId,
            actorId: userId,
            action: 'share_link.revoked',
            targetType: 'share_link',
            targetId: linkId,
            details: row!.analysis_id ? { analysisId: row!.analysis_id } : { overlayId: row!.overlay_id },
          });
        }
      });
    },

    async list(access: BenchAccess): Promise<ShareLink[]> {
      assertCaptureAction(access, 'captures.write');
      return (await listShareLinks(db, access.benchId)).map(toShareLink);
    },
  };
}

export type ShareLinksService = ReturnType<typeof createShareLinksService>;
