import type { QuoteRecord } from '@/lib/quotes/types';

/** One write from the quote page: label for a failure, method, url, body, words for success; true when it worked. */
export type QuoteRun = (
  label: string,
  method: 'POST' | 'PATCH',
  url: string,
  body: unknown,
  okTitle: string,
) => Promise<boolean>;

/** What the quote page hands each of its panels: the quote as shown, its API address, the write runner, whether a write is under way, and whether this person may write. */
export type QuotePanelProps = { quote: QuoteRecord; url: string; run: QuoteRun; busy: boolean; canWrite: boolean };
