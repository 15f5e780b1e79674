// The main navigation. Features add their entry here. `audience` hides an entry from people it
// does not concern (signed out or signed in); entries without one are always shown.
export const NAV_ITEMS: { href: string; label: string; audience?: 'signed-in' | 'signed-out' }[] = [
  { href: '/', label: 'Home' },
  { href: '/library', label: 'Library' },
  { href: '/generators', label: 'Generators' },
  { href: '/calculators', label: 'Calculators' },
  { href: '/help/safety', label: 'Shop safety' },
  { href: '/shop/members', label: 'Members', audience: 'signed-in' },
  { href: '/account', label: 'Account', audience: 'signed-in' },
  { href: '/sign-in', label: 'Sign in', audience: 'signed-out' },
];
