/** The product mark: a sun-warm disc and the name (decorative disc hidden from screen readers). */
export function Brand({ name = 'Hearthcast', large = false }: { name?: string; large?: boolean }) {
  return (
    <>
      <span aria-hidden="true" className={`inline-block rounded-full bg-gradient-to-br from-amber-300 to-ember-600 ${large ? 'h-7 w-7' : 'h-6 w-6'}`} />
      {name}
    </>
  );
}
