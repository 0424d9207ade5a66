import { areas } from '../areas';

export function NotFoundScreen() {
  return (
    <section class="screen">
      <h1>No such page</h1>
      <p>This address is not part of Rodside. Pick an area:</p>
      <ul class="area-list">
        {areas.map((a) => (
          <li key={a.id}><a href={a.path}>{a.title}</a></li>
        ))}
      </ul>
    </section>
  );
}
