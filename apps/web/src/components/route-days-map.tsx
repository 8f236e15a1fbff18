// Several technicians' routes on one Leaflet map: each a line from the start point through the stops and back, in
// the technician's colour and line pattern, with markers in their shape labelled letter + stop number ("B2"). The
// markers are pictures, not controls (close venues overlap): the columns beside the map say the same in words.
// Tiles come from the company's setting; without a tile server (or offline) the routes show on a plain ground.
import 'leaflet/dist/leaflet.css';
import { Fragment, useMemo, useState } from 'react';
import L from 'leaflet';
import { MapContainer, Marker, Polyline, TileLayer } from 'react-leaflet';
import type { RouteStyle } from './route-styles.ts';

export interface MappedRoute {
  key: string;
  name: string;
  style: RouteStyle;
  start: [number, number] | null;
  stops: { id: string; lat: number; lng: number; title: string; time: string }[];
}

function stopIcon(style: RouteStyle, n: number) {
  const radius = style.shape === 'circle' ? '50%' : '4px';
  const turn = style.shape === 'diamond' ? 'transform:rotate(45deg);' : '';
  const unturn = style.shape === 'diamond' ? 'transform:rotate(-45deg);' : '';
  return L.divIcon({
    className: '',
    html: `<span style="display:flex;align-items:center;justify-content:center;width:30px;height:30px;border-radius:${radius};background:${style.colour};border:3px solid #fff;box-shadow:0 0 0 2px ${style.colour},0 1px 3px rgba(0,0,0,.45);${turn}"><span style="color:#fff;font:800 12px/1 system-ui;${unturn}">${style.letter}${n}</span></span>`,
    iconSize: [30, 30],
    iconAnchor: [15, 15],
  });
}

function homeIcon(style: RouteStyle) {
  return L.divIcon({
    className: '',
    html: `<span style="display:flex;align-items:center;justify-content:center;width:26px;height:26px;border-radius:4px;background:#fff;border:3px solid ${style.colour};color:${style.colour};font:800 11px/1 system-ui">${style.letter}⌂</span>`,
    iconSize: [26, 26],
    iconAnchor: [13, 13],
  });
}

export default function RouteDaysMap({ routes, tileUrl, label }: { routes: MappedRoute[]; tileUrl: string; label: string }) {
  const [tilesFailed, setTilesFailed] = useState(false);
  const points = useMemo(
    () => routes.flatMap((r) => [...(r.start ? [r.start] : []), ...r.stops.map((s) => [s.lat, s.lng] as [number, number])]),
    [routes],
  );
  const bounds = useMemo(() => (points.length ? L.latLngBounds(points).pad(0.1) : null), [points]);
  const showTiles = !!tileUrl && !tilesFailed;
  return (
    <figure className="relative m-0" aria-label={label}>
      <MapContainer
        // A new set of points (another date) re-fits the view.
        key={bounds?.toBBoxString() ?? 'empty'}
        {...(bounds ? { bounds } : { center: [41.88, -87.65] as [number, number], zoom: 11 })}
        minZoom={3}
        maxZoom={18}
        scrollWheelZoom={false}
        // Attribution is owed to a tile server's data; without tiles there is nothing to credit (and its small link
        // would sit under the note below).
        attributionControl={showTiles}
        className="h-96 w-full rounded-lg"
        style={{ background: '#e8ecf3' }}
      >
        {showTiles && (
          <TileLayer
            url={tileUrl}
            attribution="Map tiles: your configured tile server"
            eventHandlers={{ tileerror: () => setTilesFailed(true) }}
          />
        )}
        {routes.map((r) => {
          const stops = r.stops.map((s) => [s.lat, s.lng] as [number, number]);
          const line = r.start ? [r.start, ...stops, r.start] : stops;
          return (
            <Fragment key={r.key}>
              {line.length > 1 && (
                <Polyline
                  positions={line}
                  pathOptions={{ color: r.style.colour, weight: 4, opacity: 0.85, dashArray: r.style.dash || undefined }}
                />
              )}
              {r.start && <Marker position={r.start} icon={homeIcon(r.style)} interactive={false} keyboard={false} />}
              {r.stops.map((s, i) => (
                <Marker key={s.id} position={[s.lat, s.lng]} icon={stopIcon(r.style, i + 1)} interactive={false} keyboard={false} />
              ))}
            </Fragment>
          );
        })}
      </MapContainer>
      {!showTiles && (
        <figcaption className="pointer-events-none absolute right-2 bottom-2 left-2 z-[1000] rounded-md bg-white/95 p-2 text-sm text-ink-soft shadow">
          {tilesFailed ? 'Map tiles could not be loaded (offline?).' : 'No map tile server is set.'} Routes are shown on a plain background
          {tileUrl ? '' : '; an owner can set a tile server in Settings'}.
        </figcaption>
      )}
    </figure>
  );
}
