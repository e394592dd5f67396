import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { errorMessage, fieldErrorOf, useShareStudyReport } from '../../../lib/api';

const MESSAGE_MAX = 2000;

/**
 * "E-mail this report": sends the report link through the service's mail path
 * (POST /api/v1/studies/{id}/share). Engineers and admins only; viewers see it disabled.
 */
export function ShareReportForm({ studyId, canShare }: { studyId: string; canShare: boolean }) {
  const [email, setEmail] = useState('');
  const [message, setMessage] = useState('');
  const share = useShareStudyReport();
  const messageId = useId();
  const emailError = fieldErrorOf(share.error, 'email');
  const messageError = fieldErrorOf(share.error, 'message');
  const submit = (event: FormEvent) => {
    event.preventDefault();
    share.mutate({ id: studyId, email: email.trim(), ...(message.trim() ? { message } : {}) });
  };
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label="E-mail this report"
      className="no-print mb-4 flex flex-col gap-3 rounded-md border border-rule p-3"
    >
      <h2 className="text-sm font-semibold tracking-wide uppercase">E-mail this report</h2>
      {!canShare ? (
        <p className="text-xs text-ink-soft">E-mailing a report needs the engineer role.</p>
      ) : null}
      <TextField
        label="Recipient e-mail"
        type="email"
        autoComplete="email"
        value={email}
        disabled={!canShare}
        maxLength={254}
        onChange={(e) => {
          setEmail(e.target.value);
          share.reset();
        }}
        error={emailError}
      />
      <div className="flex flex-col gap-1">
        <label
          htmlFor={messageId}
          className="text-xs font-medium tracking-wide text-ink-soft uppercase"
        >
          Message <span className="ml-1 normal-case text-ink-soft/80">(optional)</span>
        </label>
        <textarea
          id={messageId}
          rows={3}
          value={message}
          disabled={!canShare}
          maxLength={MESSAGE_MAX}
          aria-invalid={messageError ? true : undefined}
          aria-describedby={messageError ? `${messageId}-error` : undefined}
          onChange={(e) => setMessage(e.target.value)}
          className="rounded-md border border-rule bg-panel px-2 py-1.5 text-sm text-ink shadow-inner disabled:bg-paper disabled:text-ink-soft aria-[invalid=true]:border-bad"
        />
        {messageError ? (
          <p id={`${messageId}-error`} role="alert" className="text-xs font-medium text-bad">
            {messageError}
          </p>
        ) : null}
      </div>
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={!canShare || email.trim() === ''} busy={share.isPending}>
          Send
        </Button>
        {share.isSuccess ? (
          <p role="status" className="text-sm text-ink-soft">
            Sent to {share.data.to}.
          </p>
        ) : null}
        {share.isError && !emailError && !messageError ? (
          <p role="alert" className="text-sm text-bad">
            {errorMessage(share.error)}
          </p>
        ) : null}
      </div>
    </form>
  );
}
