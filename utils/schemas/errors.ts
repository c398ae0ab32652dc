/** The API's error envelope, as the server sends it and the client reads it (server/utils/errors.ts). */
export interface ApiIssue {
  /** Dotted path of the request field ("lines.0.jars"); "" for the request as a whole. */
  field: string
  message: string
  /** For an imported file: the line the problem is on (the header is line 1). */
  line?: number
}

export interface ApiErrorData {
  field?: string
  issues: ApiIssue[]
}
