// Pages for getting in: one narrow card in the middle of the page.
export default function SignInLayout({ children }: { children: React.ReactNode }) {
  return <div className="mx-auto flex max-w-md flex-col px-4 py-12">{children}</div>;
}
