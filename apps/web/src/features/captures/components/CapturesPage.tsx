import { useState } from 'react';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { roleAtLeast, useMe } from '../../../lib/api';
import { CaptureDetail } from './CaptureDetail';
import { CaptureList } from './CaptureList';
import { UploadForm } from './UploadForm';

/** Bench captures: upload with progress, and a capture's spectrum against a study's prediction. */
export function CapturesPage() {
  const me = useMe();
  const canUpload = roleAtLeast(me.data?.role, 'engineer');
  const [selected, setSelected] = useState<string | null>(null);
  return (
    <div>
      <PageHeader
        title="Bench captures"
        subtitle="Measured output voltage from the bench, analysed over whole periods by FFT (with a window when it is not exactly periodic) and set against a study's prediction."
      />
      <div className="grid gap-5 lg:grid-cols-[320px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          {canUpload ? (
            <UploadForm onUploaded={setSelected} />
          ) : (
            <Panel>
              <p className="text-sm">Uploading needs the engineer role.</p>
            </Panel>
          )}
          <CaptureList selected={selected} onSelect={setSelected} />
        </div>
        <div className="min-w-0">
          {selected ? (
            <CaptureDetail id={selected} />
          ) : (
            <Panel>
              <p className="text-sm text-ink-soft">Pick or upload a capture.</p>
            </Panel>
          )}
        </div>
      </div>
    </div>
  );
}
