import { cx } from './ui/cx';

/** The cautions PRODUCT.md requires wherever cultures are handled: the landing page, opening a
 * case, guides and field notes. `headingLevel` lets each page keep its headings in order. */
export function SafetyCautions({ headingLevel = 2, className }: { headingLevel?: 2 | 3; className?: string }) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section aria-labelledby="safety-cautions-heading" className={cx('rounded-soft border-2 border-clay bg-clay-mist p-5', className)}>
      <Heading id="safety-cautions-heading" className="text-xl font-extrabold text-clay-deep">
        Stay safe with living cultures
      </Heading>
      <ul className="mt-3 list-disc space-y-2 pl-6">
        <li>
          Mouldy cultures shed spores. Wear a mask, work where the air moves, and keep batches away from anyone
          with asthma, allergies or a weak immune system.
        </li>
        <li>Wash your hands afterwards. Never eat or drink a culture. Keep batches out of reach of children and animals.</li>
        <li>
          <strong className="text-ember">A batch that smells putrid, or grows black, pink or slimy, goes on the discard pile</strong> — do not
          try to rescue it.
        </li>
        <li>
          These are soil and plant inputs. Using them on food crops falls under local food-safety and organic rules: follow
          your local codes and a licensed agronomist.
        </li>
        <li>Advice here comes from community members, not from licensed professionals.</li>
      </ul>
    </section>
  );
}
