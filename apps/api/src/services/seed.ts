import type { Services } from './index.js';

/** Seeds the invented Kestrel Drives scenario into a new database (see DESIGN.md). */
export async function seedDemo(services: Services, password: string): Promise<void> {
  const { models, auth } = services;
  const passwordHash = await auth.hashPassword(password);
  const team = await models.Team.create({ name: 'Kestrel Drives' });
  const people = [
    { email: 'admin@kestrel.example', name: 'Ada Marsh', role: 'admin' as const },
    { email: 'engineer@kestrel.example', name: 'Ravi Okafor', role: 'engineer' as const },
    { email: 'engineer2@kestrel.example', name: 'Lena Brandt', role: 'engineer' as const },
    { email: 'viewer@kestrel.example', name: 'Tomas Reyes', role: 'viewer' as const },
  ];
  for (const person of people) {
    const user = await models.User.create({ email: person.email, name: person.name, passwordHash });
    await models.Membership.create({ teamId: team.id, userId: user.id, role: person.role });
  }
}
