/**
 * A library error as a form shows it: the field the library's ParameterRangeError or
 * ParameterTypeError names and its message; any other error is put on `fallback`.
 */
export function libraryFieldError(
  error: unknown,
  fallback: string,
): { field: string; message: string } {
  const field = (error as { field?: unknown } | null)?.field;
  return {
    field: typeof field === 'string' ? field : fallback,
    message: error instanceof Error ? error.message : String(error),
  };
}
