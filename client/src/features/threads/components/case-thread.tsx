// TODO(issue 4): the live thread of a case. The case page renders it below the case header.
export interface CaseThreadProps {
  caseId: number;
}

export function CaseThread(_props: CaseThreadProps) {
  return null;
}
