import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';

/** Placeholder for the notifications bell: the place in the header is kept; the count arrives with a later issue. */
export function NotificationsLink() {
  return (
    <Link to={paths.notifications.getHref()} className="flex size-10 items-center justify-center rounded-full text-white hover:bg-brand-800">
      <svg viewBox="0 0 24 24" className="size-6" aria-hidden="true">
        <path
          fill="none"
          stroke="currentColor"
          strokeWidth="2"
          strokeLinecap="round"
          strokeLinejoin="round"
          d="M6 8a6 6 0 1 1 12 0c0 7 3 8 3 8H3s3-1 3-8Zm4.3 12a2 2 0 0 0 3.4 0"
        />
      </svg>
      <span className="sr-only">Notifications</span>
    </Link>
  );
}
