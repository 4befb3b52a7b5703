import { Link } from 'react-router';
import { PAGE_WIDTH } from '../../components/layouts/content-layout';
import { SafetyCautions } from '../../components/safety-cautions';
import { buttonClasses } from '../../components/ui/button';
import { cx } from '../../components/ui/cx';
import { useUser } from '../../features/auth/api/get-me';

const STEPS = [
  {
    title: 'Describe the batch',
    text: 'Stage, ingredients, weights, dates, where it sits, what it looks and smells like — and photos.',
  },
  {
    title: 'A mentor talks it through',
    text: 'Live, on your case, until there is a likely cause and a remedy to try.',
  },
  {
    title: 'Say how it went',
    text: 'A few days later: recovered, partly, or lost. Honest outcomes are what make the Field Library worth trusting.',
  },
];

export default function LandingRoute() {
  const { data: user } = useUser();

  return (
    <div className={cx(PAGE_WIDTH, 'py-10 sm:py-14')}>
      <title>Sporewell — help for living farm inputs</title>
      <section aria-labelledby="landing-heading">
        <h1 id="landing-heading" className="max-w-3xl text-4xl font-extrabold tracking-tight text-balance sm:text-5xl">
          A second pair of eyes for a batch that is going wrong
        </h1>
        <p className="mt-5 max-w-prose text-xl">
          When your IMO, FPJ, LAB or another living input starts to smell sour, bubble, turn slimy or show a loud colour,
          Sporewell puts it in front of experienced mentors while it can still be saved, with your photos and numbers, an instant sugar
          and water check, and batches like yours that other growers already brought back.
        </p>
        <p className="mt-3 max-w-prose text-xl">
          Afterwards you tell us whether the batch recovered, and the lesson goes into the Field Library for the next grower.
        </p>
        <div className="mt-8 flex flex-wrap gap-3">
          <Link to="/cases/new" className={buttonClasses('primary', 'px-6 text-lg')}>
            Open a case
          </Link>
          <Link to="/library" className={buttonClasses('secondary', 'px-6 text-lg')}>
            Browse the Field Library
          </Link>
        </div>
        {user ? (
          <p className="mt-5">
            Signed in as {user.displayName}. <Link to="/batches">Go to your batch shelf</Link>
            {user.role === 'grower' && (
              <>
                {' '}· Made many batches? <Link to="/apply-to-mentor">Apply to mentor</Link>
              </>
            )}
          </p>
        ) : (
          <p className="mt-5">
            New here? <Link to="/join">Join Sporewell</Link>. Already a member?{' '}
            <Link to="/sign-in">Sign in</Link>
          </p>
        )}
      </section>

      <section aria-labelledby="steps-heading" className="mt-14">
        <h2 id="steps-heading" className="text-2xl font-extrabold">
          How a case goes
        </h2>
        <ol className="mt-5 grid gap-4 md:grid-cols-3">
          {STEPS.map((step, index) => (
            <li key={step.title} className="rounded-soft border border-line bg-rice-deep p-5">
              <span aria-hidden="true" className="grid size-10 place-items-center rounded-full bg-moss text-lg font-extrabold text-rice">
                {index + 1}
              </span>
              <h3 className="mt-3 text-lg font-extrabold">{step.title}</h3>
              <p className="mt-1 text-loam-soft">{step.text}</p>
            </li>
          ))}
        </ol>
      </section>

      <SafetyCautions className="mt-14" />
    </div>
  );
}
