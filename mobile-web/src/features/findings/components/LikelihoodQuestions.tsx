import { LIKELIHOOD_QUESTIONS, type LikelihoodAnswers } from '@plummet/shared';
import { ChoiceGroup } from '../../../components/ChoiceGroup';

/** The five likelihood questions of the shared risk helper, each a set of big choices. */
export function LikelihoodQuestions({ answers, onChange }: { answers: LikelihoodAnswers; onChange(answers: LikelihoodAnswers): void }) {
  return (
    <>
      {LIKELIHOOD_QUESTIONS.map((question) => (
        <ChoiceGroup
          key={question.id}
          legend={question.text}
          layout="stack"
          value={answers[question.id]}
          onChange={(answer) => onChange({ ...answers, [question.id]: answer } as LikelihoodAnswers)}
          choices={question.answers.map((answer) => ({ value: answer.id, label: answer.label }))}
          testId={`likelihood-${question.id}`}
        />
      ))}
    </>
  );
}
