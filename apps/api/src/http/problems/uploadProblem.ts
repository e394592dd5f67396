import { sentence, type Problem, type ProblemContext } from './problem.js';
import { isUploadError, isValidatorError } from './validatorError.js';

/** multer's errors as the validator's upload step passes them on: too large, or unreadable. */
export function uploadProblem(err: unknown, { req }: ProblemContext): Problem | undefined {
  if (!isValidatorError(err) || !isUploadError(err, req)) return undefined;
  if (err.status === 413) {
    return {
      status: 413,
      detail: 'The upload is larger than allowed (5 MB, one file).',
      errors: [{ path: 'file', message: 'file must be one file of at most 5 MB' }],
    };
  }
  const reason = sentence(err.message);
  const fieldProblem = /field/i.test(err.message) && !/unexpected field/i.test(err.message);
  const path = fieldProblem ? 'body' : 'file';
  const detail =
    path === 'file'
      ? `The upload could not be read (${reason.replace(/\.$/, '')}); send one CSV as the multipart field "file" with a plain file name.`
      : `The upload's form fields could not be read: ${reason}`;
  return { status: 400, detail, errors: [{ path, message: detail }] };
}
