import { Link } from 'react-router';
import { ContentLayout } from '../layouts/content-layout';
import { buttonClasses } from '../ui/button';

/**
 * "Not found", for an address no route knows and for a page whose record is gone. A Field
 * Library page that is gone was usually taken out of the library (or its case renamed), so
 * there the library's search comes first.
 */
export function NotFoundPage({ libraryPage = false }: { libraryPage?: boolean }) {
  const search = (
    <Link key="search" to="/library" className={buttonClasses(libraryPage ? 'primary' : 'secondary')}>
      Search the Field Library
    </Link>
  );
  const start = (
    <Link key="start" to="/" className={buttonClasses(libraryPage ? 'secondary' : 'primary')}>
      Back to the start
    </Link>
  );
  return libraryPage ? (
    <ContentLayout title="That Field Library page is not there" lead="It may have been taken out of the library or renamed. Search for what it was about.">
      <div className="flex flex-wrap gap-3">{[search, start]}</div>
    </ContentLayout>
  ) : (
    <ContentLayout title="We could not find that page" lead="The link may be old, or the page has moved.">
      <div className="flex flex-wrap gap-3">{[start, search]}</div>
    </ContentLayout>
  );
}
