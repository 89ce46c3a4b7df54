import { useWorkspace } from '../state/store';
import { assumptionRows } from '../viewModels/assumptions';

/** Every published default with its source and status, and the open case's overrides. */
export function AssumptionsView() {
  const caseFile = useWorkspace((state) => state.accepted);
  const rows = assumptionRows(caseFile);
  return (
    <>
      <p>{caseFile ? `Overrides shown are those of ${caseFile.patient.label}.` : 'Open a case to see its overrides beside the defaults.'}</p>
      <table className="assumptions">
        <thead><tr><th scope="col">Assumption</th><th scope="col">Default</th><th scope="col">Accepted override range</th><th scope="col">Sources and status</th><th scope="col">Alternatives</th><th scope="col">This case</th></tr></thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.id}>
              <th scope="row">{row.label}<br /><code>{row.id}</code>{row.note ? <p className="hint">{row.note}</p> : null}</th>
              <td>{row.defaultText}</td>
              <td>{row.range}</td>
              <td><ul className="plain">{row.sources.map((source) => <li key={source.id}>{source.text} <span className="status">[{source.status}]</span></li>)}</ul></td>
              <td><ul className="plain">{row.alternatives.map((text) => <li key={text}>{text}</li>)}</ul></td>
              <td>{row.override ?? 'default'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </>
  );
}
