/** One write from the quote page: label for a failure, method, url, body, words for success; true when it worked. */
export type QuoteRun = (
  label: string,
  method: 'POST' | 'PATCH',
  url: string,
  body: unknown,
  okTitle: string,
) => Promise<boolean>;
