import { MODULATION_METHOD_LABELS } from '@pulsewright/modulation';
import { useDeferredValue, useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths';
import {
  errorMessage,
  fieldErrorOf,
  roleAtLeast,
  useCreateProject,
  useDuplicateStudy,
  useMe,
  useProjects,
  useStudies,
} from '../../../lib/api';
import { formatDate } from '../../../lib/format';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';
import { describeDesign } from '../model/describeDesign';
import { ImportRecordButton } from './ImportRecordButton';

/** Projects and their studies: search, create, duplicate, pick several to compare. */
export function StudiesPage() {
  const me = useMe();
  const canEdit = roleAtLeast(me.data?.role, 'engineer');
  const [projectId, setProjectId] = useState<string>('');
  const [search, setSearch] = useState('');
  const q = useDeferredValue(search.trim());
  const projects = useProjects();
  const studies = useStudies({ projectId: projectId || undefined, q: q || undefined });
  const duplicate = useDuplicateStudy();
  const [selected, setSelected] = useState<string[]>([]);
  const navigate = useNavigate();

  return (
    <div>
      <PageHeader
        title="Studies"
        subtitle="Every saved modulation study of the team, at its current revision."
        actions={
          <>
            <Button
              variant="secondary"
              disabled={selected.length < 2}
              onClick={() => navigate(paths.compare.getHref(selected))}
            >
              Compare selected ({selected.length})
            </Button>
            {canEdit ? <ImportRecordButton projectId={projectId} /> : null}
            {canEdit ? (
              <Link
                to={paths.newStudy.getHref(projectId || undefined)}
                className="rounded-md bg-ink px-3 py-1.5 text-sm font-medium text-paper"
              >
                New study
              </Link>
            ) : null}
          </>
        }
      />
      <div className="grid gap-5 lg:grid-cols-[280px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel title="Projects">
            <QueryView query={projects} empty="No projects yet.">
              {(list) => (
                <ul className="flex flex-col gap-1 text-sm">
                  <li>
                    <button
                      type="button"
                      className={`w-full rounded px-2 py-1 text-left ${projectId === '' ? 'bg-signal-soft font-medium' : 'hover:bg-paper'}`}
                      onClick={() => setProjectId('')}
                      aria-pressed={projectId === ''}
                    >
                      All projects
                    </button>
                  </li>
                  {list.map((p) => (
                    <li key={p.id}>
                      <button
                        type="button"
                        className={`w-full rounded px-2 py-1 text-left ${projectId === p.id ? 'bg-signal-soft font-medium' : 'hover:bg-paper'}`}
                        onClick={() => setProjectId(p.id)}
                        aria-pressed={projectId === p.id}
                      >
                        {p.name} <span className="text-xs text-ink-soft">({p.studyCount})</span>
                      </button>
                    </li>
                  ))}
                </ul>
              )}
            </QueryView>
          </Panel>
          {canEdit ? <NewProjectForm onCreated={setProjectId} /> : null}
        </div>
        <Panel>
          <div className="mb-3 max-w-md">
            <TextField
              label="Search studies"
              type="search"
              placeholder="Name or note"
              value={search}
              onChange={(e) => setSearch(e.target.value)}
            />
          </div>
          <QueryView
            query={studies}
            empty={q ? `No study matches “${q}”.` : 'No studies here yet. Create one to start.'}
            loadingLabel="Loading studies…"
          >
            {(list) => (
              <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2">
                <thead className="text-left text-xs text-ink-soft uppercase">
                  <tr>
                    <th scope="col" className="w-8 py-1">
                      <span className="sr-only">Select</span>
                    </th>
                    <th scope="col" className="py-1">
                      Study
                    </th>
                    <th scope="col" className="py-1">
                      Method
                    </th>
                    <th scope="col" className="py-1">
                      Revision
                    </th>
                    <th scope="col" className="py-1">
                      Updated
                    </th>
                    <th scope="col" className="py-1">
                      <span className="sr-only">Actions</span>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {list.map((s) => (
                    <tr key={s.id} className="border-t border-rule/60">
                      <td className="py-1.5">
                        <input
                          type="checkbox"
                          className="accent-signal"
                          aria-label={`Select ${s.name} to compare`}
                          checked={selected.includes(s.id)}
                          onChange={(e) =>
                            setSelected((cur) =>
                              e.target.checked ? [...cur, s.id] : cur.filter((id) => id !== s.id),
                            )
                          }
                        />
                      </td>
                      <td className="py-1.5">
                        <Link
                          className="font-medium underline-offset-2 hover:underline"
                          to={paths.study.getHref(s.id)}
                        >
                          {s.name}
                        </Link>
                        {s.note ? <p className="text-xs text-ink-soft">{s.note}</p> : null}
                      </td>
                      <td className="py-1.5 text-xs">
                        {MODULATION_METHOD_LABELS[s.method]}
                        <br />
                        <span className="num text-ink-soft">{describeDesign(s.design)}</span>
                      </td>
                      <td className="num py-1.5">{s.revision}</td>
                      <td className="py-1.5 text-xs">{formatDate(s.updatedAt)}</td>
                      <td className="py-1.5 text-right">
                        {canEdit ? (
                          <Button
                            variant="ghost"
                            aria-label={`Duplicate ${s.name}`}
                            busy={duplicate.isPending && duplicate.variables?.id === s.id}
                            onClick={() =>
                              duplicate.mutate({ id: s.id, name: `${s.name} (copy)`.slice(0, 120) })
                            }
                          >
                            Duplicate
                          </Button>
                        ) : null}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </QueryView>
          {duplicate.isError ? (
            <p role="alert" className="mt-2 text-sm text-bad">
              {errorMessage(duplicate.error)}
            </p>
          ) : null}
        </Panel>
      </div>
    </div>
  );
}

function NewProjectForm({ onCreated }: { onCreated: (id: string) => void }) {
  const [name, setName] = useState('');
  const [description, setDescription] = useState('');
  const create = useCreateProject();
  const submit = (event: FormEvent) => {
    event.preventDefault();
    create.mutate(
      { name, description },
      {
        onSuccess: (p) => {
          setName('');
          setDescription('');
          onCreated(p.id);
        },
      },
    );
  };
  return (
    <Panel title="New project">
      <form onSubmit={submit} className="flex flex-col gap-2" noValidate>
        <TextField
          label="Project name"
          value={name}
          onChange={(e) => setName(e.target.value)}
          error={fieldErrorOf(create.error, 'name')}
        />
        <TextField
          label="Description"
          value={description}
          onChange={(e) => setDescription(e.target.value)}
          error={fieldErrorOf(create.error, 'description')}
        />
        {create.isError &&
        !fieldErrorOf(create.error, 'name') &&
        !fieldErrorOf(create.error, 'description') ? (
          <p role="alert" className="text-xs text-bad">
            {errorMessage(create.error)}
          </p>
        ) : null}
        <Button type="submit" busy={create.isPending}>
          Create project
        </Button>
      </form>
    </Panel>
  );
}
