import Link from 'next/link';

const steps = [
  {
    title: 'Talk it through',
    text: 'Counter staff capture the whole combination while the customer is at the desk: engine, heads, exhaust, converter, gearing, how the vehicle is used and how it should idle.',
  },
  {
    title: 'See the shortlist',
    text: 'The advisor ranks the cams your shop stocks for that engine, predicts each one’s torque and power curve, and says where it starts to out-pull the cam that is in there now.',
  },
  {
    title: 'Quote in minutes',
    text: 'The chosen build becomes a quote with the parts the cam needs, labour, tune and tax. The customer gets a private link and can pay the deposit online.',
  },
  {
    title: 'Learn from the dyno',
    text: 'Technicians record before-and-after pulls. Your own measured results sharpen later advice and become your best sales tool.',
  },
];

export default function LandingPage() {
  return (
    <div className="mx-auto max-w-6xl px-4 py-12">
      <section className="max-w-3xl">
        <p className="text-sm font-semibold uppercase tracking-widest text-ember-600">For shops that sell cam swaps</p>
        <h1 className="mt-2 text-4xl font-bold leading-tight text-ink sm:text-5xl">
          Pick the right cam, explain it plainly, quote it today.
        </h1>
        <p className="mt-4 text-lg text-ink-soft">
          Lobewise helps a performance shop match a camshaft to a customer’s whole engine combination, from duration at
          0.050&quot; and lobe separation to the converter stall and the axle ratio, and turns the choice into a clear
          quote.
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          <Link
            href="/sign-in"
            className="rounded-md bg-ember-500 px-5 py-3 font-semibold text-paper-raised hover:bg-ember-600"
          >
            Staff sign-in
          </Link>
          <Link
            href="/ask"
            className="rounded-md px-5 py-3 font-semibold text-gauge-700 underline ring-1 ring-steel-300 hover:bg-paper-raised"
          >
            Not sure which cam? Answer a few questions
          </Link>
        </div>
      </section>

      <section aria-labelledby="how" className="mt-16">
        <h2 id="how" className="text-xl font-semibold">
          How a job moves through Lobewise
        </h2>
        <ol className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          {steps.map((step, index) => (
            <li key={step.title} className="rounded-lg border border-steel-300 bg-paper-raised p-5">
              <span className="spec text-sm text-gauge-700">{String(index + 1).padStart(2, '0')}</span>
              <h3 className="mt-1 font-semibold">{step.title}</h3>
              <p className="mt-2 text-sm text-ink-soft">{step.text}</p>
            </li>
          ))}
        </ol>
      </section>

      <section
        aria-labelledby="care"
        className="mt-16 rounded-lg border border-caution-700/40 bg-caution-100 p-5 text-sm text-ink"
      >
        <h2 id="care" className="font-semibold">
          Good to know before any cam swap
        </h2>
        <p className="mt-2">
          Many places forbid an aftermarket cam on a road vehicle unless the part is certified for it. A bigger cam can
          lower idle vacuum and with it brake assist. Springs, piston-to-valve clearance and pushrod length must be
          checked by a qualified technician, and the engine must be re-tuned after the swap. Follow your local codes and
          licensed practice.
        </p>
      </section>
    </div>
  );
}
