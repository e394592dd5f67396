import { useId, useRef, useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { errorMessage, useImportStudyRecord, type StudyRecord } from '../../../lib/api';

/** Largest record file read (a design is a few kilobytes; the service takes bodies up to 1 MB). */
const MAX_RECORD_BYTES = 1024 * 1024;

/** A file's text (FileReader, which every browser and the test DOM have). */
function readText(file: File): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(typeof reader.result === 'string' ? reader.result : '');
    reader.onerror = () => reject(reader.error ?? new Error('the file could not be read'));
    reader.readAsText(file);
  });
}

/**
 * A file picker that imports a study record (from "Export record" on a study, here or in another
 * installation) as a new study in the chosen project, then opens it. The service checks the
 * record as it checks a new study; its message, naming the field, is shown here.
 */
export function ImportRecordButton({ projectId }: { projectId: string }) {
  const id = useId();
  const input = useRef<HTMLInputElement>(null);
  const importRecord = useImportStudyRecord();
  const navigate = useNavigate();
  const [error, setError] = useState<string | null>(null);
  const noProject = projectId === '';

  const read = async (file: File) => {
    setError(null);
    if (file.size > MAX_RECORD_BYTES) {
      setError(`${file.name} is larger than a study record can be (1 MB).`);
      return;
    }
    let record: StudyRecord;
    try {
      record = JSON.parse(await readText(file)) as StudyRecord;
    } catch (failure) {
      setError(`${file.name} is not a JSON study record: ${errorMessage(failure)}`);
      return;
    }
    importRecord.mutate(
      { projectId, record },
      {
        onSuccess: (study) => navigate(paths.study.getHref(study.id)),
        onError: (failure) => setError(errorMessage(failure)),
      },
    );
  };

  return (
    <span className="flex flex-col items-end gap-1">
      <label
        htmlFor={id}
        className={`rounded-md border border-rule px-3 py-1.5 text-sm ${noProject ? 'cursor-not-allowed text-ink-soft' : 'cursor-pointer'}`}
        title={noProject ? 'Pick a project on the left to import into' : undefined}
      >
        {importRecord.isPending ? 'Importing…' : 'Import record'}
      </label>
      <input
        ref={input}
        id={id}
        type="file"
        accept="application/json,.json"
        className="sr-only"
        disabled={noProject || importRecord.isPending}
        onChange={(e) => {
          const file = e.target.files?.[0];
          if (file) void read(file);
          if (input.current) input.current.value = '';
        }}
      />
      {noProject ? <span className="text-xs text-ink-soft">into a project: pick one</span> : null}
      {error ? (
        <span role="alert" className="max-w-sm text-xs text-bad">
          {error}
        </span>
      ) : null}
    </span>
  );
}
