import Link from "next/link";

/** A page that only says something (not found, not for your role) and offers one way back. */
export function MessagePage({ title, body, back }: { title: string; body: string; back: { href: string; label: string } }) {
  return (
    <div className="mx-auto max-w-lg py-16 text-center">
      <h1 className="text-xl font-semibold">{title}</h1>
      <p className="mt-2 text-sm text-stone-600">{body}</p>
      <Link href={back.href} className="mt-6 inline-block text-sm text-ink-700 hover:underline">
        {back.label}
      </Link>
    </div>
  );
}
