import { useData } from "vike-react/useData";
import { PageHead } from "../../../components/brief/PageHead";
import type { BriefPageData } from "../../../server/briefs/page-data";

export default function Head() {
  const { view, versionPath, siteUrl } = useData<BriefPageData>();
  return (
    <PageHead
      facts={{
        title: view.title,
        siteUrl,
        path: versionPath,
        version: view.version,
        releaseAt: view.releaseAt,
        condition: view.condition,
        description: `${view.condition}: ${view.population}`,
        withdrawn: view.withdrawal !== null,
      }}
    />
  );
}
