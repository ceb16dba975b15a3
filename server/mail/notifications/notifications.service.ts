/**
 * E-mail notices. Settings per person (opt-in), and the "analysis finished" notice: when the job
 * runner records an analysis as done or failed it calls `analysisFinished(id)`, which mails the
 * person who started it — if they turned the notice on and are still a member of the bench.
 * Sending never fails the job: problems are logged.
 */
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { NotificationSettings } from '../../contracts/notifications';
import { findMember } from '../../modules/members/members.repository';
import type { Mailer } from '../mailer';
import { analysisFinishedMail } from '../messages';
import { findAnalysisFinishedSetting, findFinishedAnalysis, saveAnalysisFinishedSetting } from './notifications.repository';

export interface NotificationsDeps {
  db: Knex;
  mailer: Mailer;
  baseUrl: string;
  logger?: Pick<Logger, 'warn'>;
}

export function createNotificationsService({ db, mailer, baseUrl, logger }: NotificationsDeps) {
  return {
    async get(userId: string): Promise<NotificationSettings> {
      return { analysisFinished: await findAnalysisFinishedSetting(db, userId) };
    },

    async save(userId: string, settings: NotificationSettings): Promise<NotificationSettings> {
      await saveAnalysisFinishedSetting(db, userId, settings.analysisFinished);
      return { analysisFinished: await findAnalysisFinishedSetting(db, userId) };
    },

    /** Sends the notice for a finished analysis when its starter asked for it; true when one was sent. */
    async analysisFinished(analysisId: string): Promise<boolean> {
      try {
        const row = await findFinishedAnalysis(db, analysisId);
        if (!row || !row.created_by || !row.email || !row.analysis_finished) return false;
        if (row.status !== 'done' && row.status !== 'failed') return false;
        if (!(await findMember(db, row.bench_id, row.created_by))) return false;
        await mailer.send(
          analysisFinishedMail({
            to: row.email,
            fileName: row.file_name,
            benchName: row.bench_name,
            status: row.status,
            error: row.error,
            link: `${baseUrl}/benches/${row.bench_id}/spectra/${row.analysis_id}`,
          }),
        );
        return true;
      } catch (err) {
        logger?.warn({ err, analysisId }, 'sending the "analysis finished" notice failed');
        return false;
      }
    },
  };
}

export type NotificationsService = ReturnType<typeof createNotificationsService>;
