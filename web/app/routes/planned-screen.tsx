import { PageHeader } from '../../components/ui/page-header';

/** A screen whose own feature has not landed yet: its name and what it will hold. */
export function PlannedScreen({ title, description }: { title: string; description: string }) {
  return <PageHeader title={title} description={description} />;
}
