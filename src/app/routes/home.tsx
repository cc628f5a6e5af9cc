import type { ReactNode } from 'react';
import { paths } from '@/config/paths';
import { ButtonLink, Card } from '@/components/ui';
import { useMe } from '@/features/auth/hooks/use-me';
import { useCan } from '@/features/auth/hooks/use-can';
import { useDocumentTitle } from '@/lib/use-document-title';

type Side = { id: string; title: string; lead: string; points: ReactNode[]; cta: { label: string; to: string } };

const SIDES: Side[] = [
  {
    id: 'songwriters',
    title: 'For songwriters',
    lead: 'You have a song but no drummer and no room to record drums in.',
    points: [
      <>
        Post a <strong>brief</strong>: the song’s tempo, key and length, a guide track, the style, and the{' '}
        <strong>deliverables</strong> you want back (which files, at what quality).
      </>,
      'Session drummers answer with quotes and reels; compare price, turnaround and sound.',
      <>
        Your money waits in <strong>escrow</strong>: Kitlane holds it until you accept the recording.
      </>,
    ],
    cta: { label: 'Post your first brief', to: paths.signUp.getHref() },
  },
  {
    id: 'drummers',
    title: 'For drummers',
    lead: 'You play well and record at home or in a room you book.',
    points: [
      'Keep a profile with your styles, kit, rates and turnaround, plus a reel to listen to.',
      'Find open briefs and quote in a few lines: fee, revisions included, rights terms.',
      <>
        Deliver <strong>stems</strong> (one WAV file per microphone, all the same length from one start point) and get paid when the
        songwriter accepts.
      </>,
    ],
    cta: { label: 'Join as a drummer', to: paths.signUp.getHref() },
  },
  {
    id: 'engineers',
    title: 'For engineers',
    lead: 'You run a room and a set of mics that drums sound good in.',
    points: [
      'List your rooms with their size and surfaces, and your mic packages as an input list.',
      'Be attached to a drummer’s quote, so the songwriter books player and room in one go.',
      'Deliver the stems with the drummer and receive your share when the money is released.',
    ],
    cta: { label: 'List your room', to: paths.signUp.getHref() },
  },
];

const STEPS = [
  { title: 'Post a brief', text: 'Tempo, key, length and what you want delivered.' },
  { title: 'Compare quotes', text: 'Drummers and rooms answer with price, reel and turnaround.' },
  { title: 'Pay into escrow', text: 'Kitlane holds the money; nobody is paid yet.' },
  { title: 'Review the stems', text: 'Listen in the browser; every file is checked automatically.' },
  { title: 'Accept', text: 'The money is released to the drummer and engineer.' },
];

function SideCard({ side, signedIn }: { side: Side; signedIn: boolean }) {
  return (
    <Card className="flex flex-col">
      <h2 id={`${side.id}-title`} className="text-2xl font-bold">
        {side.title}
      </h2>
      <p className="mt-2 text-ink-muted">{side.lead}</p>
      <ul className="mt-4 flex-1 list-disc space-y-2 pl-5">
        {side.points.map((point, i) => (
          <li key={i}>{point}</li>
        ))}
      </ul>
      {/* Signed-in people get their own next step in the hero instead of a sign-up pitch. */}
      {signedIn ? null : (
        <ButtonLink to={side.cta.to} variant="secondary" className="mt-6 self-start">
          {side.cta.label}
        </ButtonLink>
      )}
    </Card>
  );
}

/** The hero's calls to action: join for newcomers, the own next step for people signed in. */
function NextStepForMe() {
  const { user } = useMe();
  const canBrief = useCan('create:brief:own');
  const canQuote = useCan('create:quote:own');
  const canListRoom = useCan('create:room:own');
  if (!user) {
    return (
      <div className="mt-8 flex flex-wrap gap-3">
        <ButtonLink to={paths.signUp.getHref()}>Join Kitlane</ButtonLink>
        <ButtonLink to={paths.findDrummers.getHref()} variant="secondary">
          Find drummers
        </ButtonLink>
      </div>
    );
  }
  return (
    <div className="mt-8 flex flex-wrap gap-3">
      {canBrief ? <ButtonLink to={paths.myBriefs.getHref()}>Go to my briefs</ButtonLink> : null}
      {canQuote ? <ButtonLink to={paths.openBriefs.getHref()}>See open briefs</ButtonLink> : null}
      {canListRoom ? (
        <ButtonLink to={paths.myRooms.getHref()} variant={canBrief || canQuote ? 'secondary' : 'primary'}>
          Manage my rooms
        </ButtonLink>
      ) : null}
      <ButtonLink to={paths.account.getHref()} variant="secondary">
        My account
      </ButtonLink>
    </div>
  );
}

export function Component() {
  const { user } = useMe();
  useDocumentTitle('');
  return (
    <div className="space-y-14">
      <section aria-labelledby="hero-title" className="rounded-3xl bg-canvas-raised px-6 py-10 shadow-sm sm:px-10 sm:py-14">
        <p className="font-bold tracking-wide text-brand-800 uppercase">Remote drum tracks</p>
        <h1 id="hero-title" className="mt-3 max-w-3xl text-4xl font-bold tracking-tight sm:text-5xl">
          {user ? `Welcome back, ${user.displayName}.` : 'Real drums on your song, recorded by a session drummer, wherever you are.'}
        </h1>
        <p className="mt-4 max-w-2xl text-lg text-ink-muted">
          Kitlane connects songwriters with session drummers and the engineers whose rooms they record in. You agree the job online, the
          money is held safely, and the finished drum tracks arrive as files you can check before anyone is paid.
        </p>
        <NextStepForMe />
      </section>

      <section aria-labelledby="sides-title">
        <h2 id="sides-title" className="sr-only">
          Who Kitlane is for
        </h2>
        <div className="grid gap-6 md:grid-cols-3">
          {SIDES.map((side) => (
            <SideCard key={side.id} side={side} signedIn={user !== null} />
          ))}
        </div>
      </section>

      <section aria-labelledby="how-title">
        <h2 id="how-title" className="text-3xl font-bold tracking-tight">
          How it works
        </h2>
        <ol className="mt-6 grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
          {STEPS.map((step, i) => (
            <li key={step.title} className="rounded-2xl border border-line bg-canvas-raised p-5">
              <span className="flex size-9 items-center justify-center rounded-full bg-accent-300 font-bold text-ink" aria-hidden="true">
                {i + 1}
              </span>
              <p className="mt-3 text-lg font-bold">{step.title}</p>
              <p className="mt-1 text-ink-muted">{step.text}</p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}
