import Link from 'next/link';

/** Where this page sits, as links; hidden on paper. */
export function Breadcrumb({ items }: { items: { href: string; label: string }[] }) {
  return (
    <nav aria-label="Breadcrumb" className="mb-2 text-sm print:hidden">
      {items.map((item, i) => (
        <span key={item.href}>
          {i > 0 ? (
            <span aria-hidden="true" className="px-2 text-ink-faint">
              /
            </span>
          ) : null}
          <Link href={item.href} className="text-blueprint underline">
            {item.label}
          </Link>
        </span>
      ))}
    </nav>
  );
}
