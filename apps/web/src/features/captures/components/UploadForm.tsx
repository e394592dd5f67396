import { useRef, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { errorMessage, fieldErrorOf, useUploadCapture } from '../../../lib/api';

/** Upload a bench capture (CSV) with its progress; `onUploaded` receives the new capture's id. */
export function UploadForm({ onUploaded }: { onUploaded: (id: string) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState('');
  const [progress, setProgress] = useState(0);
  const upload = useUploadCapture();
  const input = useRef<HTMLInputElement>(null);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return;
    setProgress(0);
    upload.mutate(
      { file, name: name || file.name.replace(/\.[^.]+$/, ''), onProgress: setProgress },
      {
        onSuccess: (capture) => {
          onUploaded(capture.id);
          setFile(null);
          setName('');
          if (input.current) input.current.value = '';
        },
      },
    );
  };
  const percent = Math.round(progress * 100);
  return (
    <Panel title="Upload a capture">
      <form onSubmit={submit} className="flex flex-col gap-3" noValidate>
        <div className="flex flex-col gap-1">
          <label
            htmlFor="capture-file"
            className="text-xs font-medium tracking-wide text-ink-soft uppercase"
          >
            CSV file (time, voltage, optional current; at most 5 MB)
          </label>
          <input
            id="capture-file"
            ref={input}
            type="file"
            accept=".csv,text/csv"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className="text-sm"
            aria-describedby="capture-file-error"
          />
          {fieldErrorOf(upload.error, 'file') ? (
            <p id="capture-file-error" role="alert" className="text-xs text-bad">
              {fieldErrorOf(upload.error, 'file')}
            </p>
          ) : null}
        </div>
        <TextField
          label="Name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={fieldErrorOf(upload.error, 'name')}
        />
        {upload.isPending || upload.isSuccess ? (
          <div>
            <div className="mb-1 flex justify-between text-xs">
              <span>{upload.isSuccess ? 'Uploaded' : 'Uploading'}</span>
              <span className="num">{percent} %</span>
            </div>
            <div
              role="progressbar"
              aria-label="Upload progress"
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={percent}
              className="h-3 overflow-hidden rounded-full bg-rule"
            >
              <div className="h-full bg-signal" style={{ width: `${percent}%` }} />
            </div>
          </div>
        ) : null}
        {upload.isError && !fieldErrorOf(upload.error, 'file') ? (
          <p role="alert" className="text-sm text-bad">
            {errorMessage(upload.error)}
          </p>
        ) : null}
        <Button type="submit" busy={upload.isPending} disabled={!file}>
          Upload
        </Button>
      </form>
    </Panel>
  );
}
