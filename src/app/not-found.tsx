import Link from 'next/link';

export default function NotFound() {
  return (
    <div className="mx-auto max-w-xl px-4 py-16">
      <h1 className="text-2xl font-semibold">That page isn’t here</h1>
      <p className="mt-2 text-ink-soft">The link may be old or mistyped. Start again from the front page.</p>
      <Link href="/" className="mt-6 inline-block rounded-md bg-ink px-4 py-2 text-paper">
        Back to Lobewise
      </Link>
    </div>
  );
}
