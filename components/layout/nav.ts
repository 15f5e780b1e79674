// The main navigation. Features add their entry here.
export const NAV_ITEMS: { href: string; label: string }[] = [
  { href: '/', label: 'Home' },
  { href: '/help/safety', label: 'Shop safety' },
];
