import { useParams } from 'react-router-dom';
import { BudgetWithContributions } from '../../budget/components/BudgetTable';
import { ReportPage } from '../../features/report/components/ReportPage';

/** The printable report of one stored version, with the editor's budget table in its slot. */
export default function ReportRoute() {
  const { id, n } = useParams();
  return <ReportPage budgetId={Number(id)} versionNumber={Number(n)} renderBudgetTable={(model) => <BudgetWithContributions model={model} />} />;
}
