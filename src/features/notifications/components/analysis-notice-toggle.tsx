import { FormAlert } from '../../../components/ui/notes';
import { useNotificationSettings } from '../api/get-notification-settings';
import { useSaveNotificationSettings } from '../api/save-notification-settings';

/** The opt-in "analysis finished" e-mail. */
export function AnalysisNoticeToggle() {
  const settings = useNotificationSettings();
  const save = useSaveNotificationSettings();
  return (
    <div className="flex flex-col gap-3">
      <label className="flex items-start gap-3 text-sm text-ink">
        <input
          type="checkbox"
          className="mt-0.5 h-4 w-4 accent-accent"
          checked={settings.analysisFinished}
          disabled={save.isPending}
          onChange={(e) => save.mutate({ analysisFinished: e.target.checked })}
        />
        <span>
          E-mail me when an analysis I started finishes
          <span className="mt-0.5 block text-xs text-ink-faint">One message per analysis, with a link to its spectrum (or the reason it failed).</span>
        </span>
      </label>
      <FormAlert message={save.isError ? save.error.message : null} />
    </div>
  );
}
