import { useEffect, useMemo, useState } from 'react';
import { geoAlbersUsa, geoPath } from 'd3-geo';
import { feature, mesh } from 'topojson-client';
import type { Feature, FeatureCollection, Geometry } from 'geojson';
import type { GeometryCollection, Topology } from 'topojson-specification';
import statesUrl from 'us-atlas/states-10m.json?url';
import { jurisdictionByCode } from '@amberline/common';

type StatesTopology = Topology<{ states: GeometryCollection<{ name: string }> }>;
export type RoutePoint = { order: number; jurisdiction: string; lat: number; lon: number; label?: string };

let cache: Promise<StatesTopology> | null = null;
const loadStates = () => (cache ??= fetch(statesUrl).then((r) => r.json() as Promise<StatesTopology>));

const WIDTH = 960;
const HEIGHT = 600;

/** The states on the route, shaded, with the route's points in order. Drawn offline from the bundled atlas. */
export function RouteMap({ points, height = 260 }: { points: RoutePoint[]; height?: number }) {
  const [topo, setTopo] = useState<StatesTopology | null>(null);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    let live = true;
    loadStates().then((t) => live && setTopo(t)).catch(() => live && setFailed(true));
    return () => {
      live = false;
    };
  }, []);

  const drawn = useMemo(() => {
    if (!topo) return null;
    const states = feature(topo, topo.objects.states) as FeatureCollection<Geometry, { name: string }>;
    const onRoute = new Set(points.map((p) => jurisdictionByCode(p.jurisdiction)?.name).filter(Boolean) as string[]);
    const routeStates: FeatureCollection<Geometry, { name: string }> = { type: 'FeatureCollection', features: states.features.filter((f) => onRoute.has(f.properties.name)) };
    // fit to the route's states, with the whole country as the backdrop
    const projection = geoAlbersUsa().fitExtent([[20, 20], [WIDTH - 20, HEIGHT - 20]], routeStates.features.length ? routeStates : states);
    const path = geoPath(projection);
    const borders = path(mesh(topo, topo.objects.states, (a, b) => a !== b)) ?? '';
    const xy = points.map((p) => ({ ...p, at: projection([p.lon, p.lat]) }));
    return { states: states.features as Feature<Geometry, { name: string }>[], onRoute, path, borders, xy };
  }, [topo, points]);

  if (failed) return null;
  if (!drawn) return <div style={{ height }} aria-busy="true" />;
  const line = drawn.xy.filter((p) => p.at).map((p) => p.at!.join(',')).join(' ');
  return (
    <svg viewBox={`0 0 ${WIDTH} ${HEIGHT}`} style={{ width: '100%', height, background: '#f1f5f9', borderRadius: 4 }} role="img" aria-label={`Route map: ${[...drawn.onRoute].join(', ')}`} data-testid="route-map">
      {drawn.states.map((f) => (
        <path key={f.properties.name} d={drawn.path(f) ?? ''} fill={drawn.onRoute.has(f.properties.name) ? '#fde68a' : '#e2e8f0'} />
      ))}
      <path d={drawn.borders} fill="none" stroke="#94a3b8" strokeWidth={0.8} />
      <polyline points={line} fill="none" stroke="#b45309" strokeWidth={4} strokeDasharray="10 6" />
      {drawn.xy.map((p) =>
        p.at ? (
          <g key={p.order} transform={`translate(${p.at[0]},${p.at[1]})`}>
            <circle r={14} fill="#1e293b" />
            <text textAnchor="middle" dy={5} fontSize={15} fill="#fff" fontWeight={700}>
              {p.order}
            </text>
          </g>
        ) : null,
      )}
    </svg>
  );
}
