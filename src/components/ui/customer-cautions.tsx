// The trade's cautions on a customer page (the questionnaire's result, the quote's page), in the large look
// of customer pages. Each page passes its own list: the shortlist's and the quote's cautions differ.
export function CustomerCautions({ cautions }: { cautions: readonly string[] }) {
  return (
    <section aria-labelledby="care" className="mt-8 rounded-lg border border-caution-700/40 bg-caution-100 p-5">
      <h2 id="care" className="text-2xl font-semibold">
        Good to know before a cam swap
      </h2>
      <ul className="mt-3 flex list-disc flex-col gap-2 pl-6">
        {cautions.map((text) => (
          <li key={text}>{text}</li>
        ))}
      </ul>
    </section>
  );
}
