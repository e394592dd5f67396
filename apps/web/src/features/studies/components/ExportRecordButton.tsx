import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { errorMessage, getStudyRecord } from '../../../lib/api';
import { downloadText } from '../../../lib/download';

/**
 * Downloads the study at its current revision as a record (GET /studies/{id}/record): a
 * versioned JSON document with no ids, to keep under version control or import elsewhere.
 */
export function ExportRecordButton({ studyId, fileStem }: { studyId: string; fileStem: string }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const download = async () => {
    setBusy(true);
    setError(null);
    try {
      const record = await getStudyRecord(studyId);
      downloadText(
        `${JSON.stringify(record, null, 2)}\n`,
        `${fileStem}.study.json`,
        'application/json',
      );
    } catch (failure) {
      setError(errorMessage(failure));
    } finally {
      setBusy(false);
    }
  };
  return (
    <>
      <Button variant="secondary" busy={busy} onClick={() => void download()}>
        Export record
      </Button>
      {error ? (
        <span role="alert" className="text-xs text-bad">
          {error}
        </span>
      ) : null}
    </>
  );
}
