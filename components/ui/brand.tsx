import Link from 'next/link';

/** Outturn's mark: a rising curve that settles at a marked level, inside a square. */
export function BrandMark({ size = 22 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 24 24" aria-hidden="true" className="shrink-0">
      <rect x="1" y="1" width="22" height="22" rx="4" className="fill-cost" />
      <path
        d="M4.5 18.5 C 9 18.5, 10 6, 19.5 5.5"
        fill="none"
        stroke="#fffdf8"
        strokeWidth="2"
        strokeLinecap="round"
      />
      <line x1="4.5" y1="9" x2="19.5" y2="9" stroke="#f3c56b" strokeWidth="1.4" strokeDasharray="2 1.6" />
    </svg>
  );
}

export function Brand({ href = '/' }: { href?: string }) {
  return (
    <Link href={href} className="flex items-center gap-2 font-semibold tracking-tight text-ink">
      <BrandMark />
      <span className="text-lg">Outturn</span>
    </Link>
  );
}
