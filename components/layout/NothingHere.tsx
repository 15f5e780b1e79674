// The page for an address that names nothing: a generator or calculator id that does not exist.
import { AppFrame } from './AppFrame';
import { LinkButton, Notice } from '../library/controls';

export function NothingHere({ title, message, back }: { title: string; message: string; back: { href: string; label: string } }) {
  return (
    <AppFrame title={title}>
      <Notice tone="info" action={<LinkButton href={back.href} tone="secondary" label={back.label} />}>
        {message}
      </Notice>
    </AppFrame>
  );
}
