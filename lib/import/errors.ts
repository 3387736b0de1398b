/**
 * A file the importer refuses as a whole, with the HTTP status the import route answers.
 * 413: the file, or its unpacked content, is too large; 415: not an .xlsx or .csv by its content;
 * 422: a spreadsheet that cannot be used as it is (damaged, empty, too many rows); 503: the
 * server is reading as many uploads as it takes at once, try again shortly.
 * The message is meant for the user: it says what is wrong and what to upload instead.
 */
export type ImportFileStatus = 413 | 415 | 422 | 503;

export class ImportFileError extends Error {
  readonly status: ImportFileStatus;
  constructor(status: ImportFileStatus, message: string) {
    super(message);
    this.name = "ImportFileError";
    this.status = status;
  }
}
