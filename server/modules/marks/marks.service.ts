/**
 * Marks on a capture's spectrum: list (any member), add (owner, analyst), edit and delete (the author
 * or an owner). Frequencies are checked against the spectrum's band (mark-band.ts). Roles are checked
 * before the body is parsed, so a refused member learns nothing about validation.
 */
import type { Knex } from 'knex';
import type { CreateMarkRequest, Mark, MarksResponse, UpdateMarkRequest } from '../../contracts/marks';
import { conflict } from '../../errors';
import { newId } from '../../lib/ids';
import type { BenchAccess } from '../benches/bench-policy';
import { accessFromRow, assertCaptureAction, assertIdShape, CAPTURE_NOT_FOUND } from '../captures/capture-policy';
import { findCaptureForUser } from '../captures/captures.repository';
import { assertInsideBand, spectrumBand, type SpectrumBand } from './mark-band';
import { assertMayChangeNote, mayChangeNote } from './mark-policy';
import {
  deleteMark,
  findLatestDoneSpectrumRange,
  findMarkForUser,
  findMarkWithAuthor,
  insertMark,
  listMarksOfCapture,
  updateMark,
  type MarkRowWithAuthor,
} from './marks.repository';

export const MARK_NOT_FOUND = 'no such mark, or it is not on a bench of yours';

const iso = (d: Date | string) => new Date(d).toISOString();

export function toMark(row: MarkRowWithAuthor, access: BenchAccess): Mark {
  return {
    id: row.id,
    captureId: row.capture_id,
    kind: row.kind,
    text: row.text,
    frequencyHz: row.hi_hz === null ? row.lo_hz : null,
    bandHz: row.hi_hz === null ? null : [row.lo_hz, row.hi_hz],
    authorId: row.author_id,
    authorName: row.author_name,
    canEdit: mayChangeNote(access, row.author_id),
    createdAt: iso(row.created_at),
    updatedAt: iso(row.updated_at),
  };
}

export function createMarksService({ db }: { db: Knex }) {
  async function captureAccess(userId: string, captureId: string): Promise<BenchAccess> {
    assertIdShape(captureId, CAPTURE_NOT_FOUND);
    const capture = await findCaptureForUser(db, captureId, userId);
    return accessFromRow(capture, userId, CAPTURE_NOT_FOUND);
  }

  async function bandOf(captureId: string): Promise<SpectrumBand | null> {
    const range = await findLatestDoneSpectrumRange(db, captureId);
    return range ? spectrumBand(range) : null;
  }

  async function requireBand(captureId: string): Promise<SpectrumBand> {
    const band = await bandOf(captureId);
    if (!band) {
      throw conflict('this capture has no finished spectrum yet; marks are pinned to its frequency axis, so add them once an analysis is done');
    }
    return band;
  }

  async function markAccess(userId: string, markId: string) {
    assertIdShape(markId, MARK_NOT_FOUND);
    const row = await findMarkForUser(db, markId, userId);
    const access = accessFromRow(row, userId, MARK_NOT_FOUND);
    return { row: row!, access };
  }

  async function reply(markId: string, access: BenchAccess): Promise<Mark> {
    const row = await findMarkWithAuthor(db, markId);
    if (!row) throw new Error('the mark vanished right after it was written');
    return toMark(row, access);
  }

  return {
    async list(userId: string, captureId: string): Promise<MarksResponse> {
      const access = await captureAccess(userId, captureId);
      assertCaptureAction(access, 'captures.read');
      const [rows, band] = await Promise.all([listMarksOfCapture(db, captureId), bandOf(captureId)]);
      return { marks: rows.map((r) => toMark(r, access)), bandHz: band ? [band.loHz, band.hiHz] : null };
    },

    async create(userId: string, captureId: string, parse: () => CreateMarkRequest): Promise<Mark> {
      const access = await captureAccess(userId, captureId);
      assertCaptureAction(access, 'captures.write');
      const body = parse();
      assertInsideBand(body, await requireBand(captureId));
      const id = newId();
      await insertMark(db, {
        id,
        capture_id: captureId,
        author_id: userId,
        kind: body.kind,
        text: body.text,
        lo_hz: body.bandHz ? body.bandHz[0] : body.frequencyHz!,
        hi_hz: body.bandHz ? body.bandHz[1] : null,
        created_at: new Date(),
      });
      return reply(id, access);
    },

    async update(userId: string, markId: string, parse: () => UpdateMarkRequest): Promise<Mark> {
      const { row, access } = await markAccess(userId, markId);
      assertCaptureAction(access, 'captures.write');
      assertMayChangeNote(access, row.author_id, 'marks', 'edit');
      const body = parse();
      const patch: Parameters<typeof updateMark>[2] = {};
      if (body.kind !== undefined) patch.kind = body.kind;
      if (body.text !== undefined) patch.text = body.text;
      if (body.frequencyHz !== undefined || body.bandHz !== undefined) {
        assertInsideBand(body, await requireBand(row.capture_id));
        patch.lo_hz = body.bandHz ? body.bandHz[0] : body.frequencyHz!;
        patch.hi_hz = body.bandHz ? body.bandHz[1] : null;
      }
      await updateMark(db, markId, patch);
      return reply(markId, access);
    },

    async remove(userId: string, markId: string): Promise<void> {
      const { row, access } = await markAccess(userId, markId);
      assertCaptureAction(access, 'captures.write');
      assertMayChangeNote(access, row.author_id, 'marks', 'delete');
      await deleteMark(db, markId);
    },
  };
}

export type MarksService = ReturnType<typeof createMarksService>;
