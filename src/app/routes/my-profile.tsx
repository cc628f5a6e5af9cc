import { Link } from 'react-router-dom';
import { Card, EmptyState, PageHeader, ButtonLink } from '@/components/ui';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/hooks/use-me';
import { useMyDrummerProfile } from '@/features/profiles/api/get-my-drummer-profile';
import { useMyEngineerProfile } from '@/features/profiles/api/get-my-engineer-profile';
import { DrummerProfileForm } from '@/features/profiles/components/drummer-profile-form';
import { EngineerProfileForm } from '@/features/profiles/components/engineer-profile-form';
import { ReelManager } from '@/features/reels/components/reel-manager';
import { QueryState } from '@/features/briefs/components/query-state';
import { useDocumentTitle } from '@/lib/use-document-title';

export function Component() {
  useDocumentTitle('My profile');
  const { user } = useMe();
  const isDrummer = !!user?.roles.includes('drummer');
  const isEngineer = !!user?.roles.includes('engineer');
  const drummer = useMyDrummerProfile(isDrummer);
  const engineer = useMyEngineerProfile(isEngineer);

  if (!isDrummer && !isEngineer) {
    return (
      <>
        <PageHeader title="My profile" />
        <EmptyState title="Profiles are for drummers and engineers" action={<ButtonLink to={paths.account.getHref()}>Add a role in your account</ButtonLink>}>
          Songwriters do not need a public profile: post a brief and drummers come to you.
        </EmptyState>
      </>
    );
  }
  return (
    <>
      <PageHeader
        title="My profile"
        description="What songwriters see about you."
        actions={
          isDrummer && drummer.data?.profile.listed && user ? (
            <Link to={paths.drummer.getHref(user.id)} className="font-medium text-brand-800 underline">
              View my public page
            </Link>
          ) : undefined
        }
      />
      <div className="space-y-8">
        {isDrummer ? (
          <QueryState isPending={drummer.isPending} error={drummer.error} retry={() => void drummer.refetch()} loadingLabel="Loading your drummer profile">
            {() => (
              <>
                <Card className="space-y-4">
                  <h2 className="text-xl font-bold">Drummer profile</h2>
                  <DrummerProfileForm profile={drummer.data!.profile} />
                </Card>
                <ReelManager tracks={drummer.data!.reelTracks} />
              </>
            )}
          </QueryState>
        ) : null}
        {isEngineer ? (
          <QueryState isPending={engineer.isPending} error={engineer.error} retry={() => void engineer.refetch()} loadingLabel="Loading your engineer profile">
            {() => (
              <Card className="space-y-4">
                <h2 className="text-xl font-bold">Engineer profile</h2>
                <EngineerProfileForm profile={engineer.data!.profile} />
              </Card>
            )}
          </QueryState>
        ) : null}
      </div>
    </>
  );
}
