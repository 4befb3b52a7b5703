import { ContentLayout } from './content-layout';

/** Stands in for a page that is not built yet, so the route, its guard and the navigation work. */
export function PlaceholderPage({ title }: { title: string }) {
  return <ContentLayout title={title} lead="This part of Sporewell is being built." />;
}
