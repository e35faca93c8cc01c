/**
 * Output to a pipe whose reader may leave early (`fieldgap diagram --csv |
 * head`): once the reader has closed it (EPIPE), further output is dropped
 * and the command ends normally and quietly, instead of dying with an
 * unhandled 'error' event and a stack trace.
 */

/** A writer of text to `stream` that goes quiet after EPIPE; other stream errors are rethrown. */
export function pipeWriter(stream: NodeJS.WritableStream): (text: string) => void {
  let closed = false;
  stream.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') {
      closed = true;
      return;
    }
    throw error;
  });
  return (text) => {
    if (!closed) stream.write(text);
  };
}
