/** The corrections panel with the bench's analysed captures offered as references (their latest finished analysis). */
import { useReferenceAnalyses } from '../api/list-reference-analyses';
import { CorrectionsPanel } from './corrections-panel';

export function CorrectionsSection({ benchId, analysisId, done, canWrite }: { benchId: string; analysisId: string; done: boolean; canWrite: boolean }) {
  const references = useReferenceAnalyses(benchId, done);
  return <CorrectionsPanel analysisId={analysisId} done={done} canWrite={canWrite} references={references.data ?? []} />;
}
