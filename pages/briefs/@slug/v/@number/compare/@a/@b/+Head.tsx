import { useData } from "vike-react/useData";
import { PageHead } from "../../../../../../../../components/brief/PageHead";
import type { ComparisonPageData } from "../../../../../../../../server/briefs/page-data";

export default function Head() {
  const { view, path, siteUrl } = useData<ComparisonPageData>();
  return (
    <PageHead
      facts={{
        title: `${view.treatment.name} vs ${view.comparator.name}: ${view.title}`,
        siteUrl,
        path,
        version: view.version,
        releaseAt: view.releaseAt,
        condition: view.condition,
        description: `${view.treatment.name} compared with ${view.comparator.name} in ${view.population.toLowerCase()}`,
        withdrawn: view.withdrawal !== null,
      }}
    />
  );
}
