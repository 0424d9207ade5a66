// Tabs between the parts of an area; each part has its own path, so deep links and the back button work.
export function SubNav(props: { label: string; current: string; items: readonly { path: string; title: string }[] }) {
  return (
    <nav class="subnav" aria-label={props.label}>
      {props.items.map((i) => (
        <a key={i.path} href={i.path} class={i.path === props.current ? 'subnav-link active' : 'subnav-link'} aria-current={i.path === props.current ? 'page' : undefined}>
          {i.title}
        </a>
      ))}
    </nav>
  );
}
