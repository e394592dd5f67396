import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { useCapture } from '../../../lib/api';
import { CaptureAnalysis } from './CaptureAnalysis';

/** One capture, loaded with its series, then analysed. */
export function CaptureDetail({ id }: { id: string }) {
  const capture = useCapture(id);
  if (capture.isPending) return <Loading label="Loading the capture…" />;
  if (capture.isError)
    return <ErrorState error={capture.error} onRetry={() => capture.refetch()} />;
  return <CaptureAnalysis capture={capture.data} />;
}
