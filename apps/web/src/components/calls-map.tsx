// Open calls on a Leaflet map, clustered. Tiles come from the company's setting; without a tile server
// (or when tiles fail to load, e.g. offline) the markers still show on a plain background with a note.
import 'leaflet/dist/leaflet.css';
import 'leaflet.markercluster/dist/MarkerCluster.css';
import { useMemo, useState } from 'react';
import L from 'leaflet';
import { MapContainer, Marker, Popup, TileLayer } from 'react-leaflet';
import MarkerClusterGroup from 'react-leaflet-cluster';
import { Link } from 'react-router-dom';
import { callStateLabels, type CallState } from '@bumperline/contracts/call-vocabulary';

export interface MapPoint {
  id: string;
  lat: number;
  lon: number;
  title: string;
  subtitle: string;
  state: CallState;
  late: boolean;
  href: string;
}

// Our own marker: a ring whose mark and colour follow the state; the popup says it in words.
function markerIcon(p: MapPoint) {
  const tone = p.late ? '#a3161a' : p.state === 'reported' ? '#a3161a' : p.state === 'fixed' ? '#11643a' : '#8a4b00';
  const mark = p.late ? '!' : p.state === 'reported' ? '×' : p.state === 'fixed' ? '✓' : '•';
  return L.divIcon({
    className: '',
    html: `<span style="display:flex;align-items:center;justify-content:center;width:30px;height:30px;border-radius:50%;background:#fff;border:4px solid ${tone};color:${tone};font:800 16px/1 system-ui;box-shadow:0 1px 3px rgba(0,0,0,.4)">${mark}</span>`,
    iconSize: [30, 30],
    iconAnchor: [15, 15],
  });
}

// Clusters in our own look: an ink disc with the count.
function clusterIcon(cluster: { getChildCount(): number }) {
  const n = cluster.getChildCount();
  const size = n < 10 ? 34 : n < 50 ? 40 : 46;
  return L.divIcon({
    className: '',
    html: `<span style="display:flex;align-items:center;justify-content:center;width:${size}px;height:${size}px;border-radius:50%;background:#14213d;border:3px solid #d4a017;color:#fff;font:800 15px/1 system-ui;box-shadow:0 1px 3px rgba(0,0,0,.4)">${n}</span>`,
    iconSize: [size, size],
    iconAnchor: [size / 2, size / 2],
  });
}

export function CallsMap({ points, tileUrl, label }: { points: MapPoint[]; tileUrl: string; label: string }) {
  const [tilesFailed, setTilesFailed] = useState(false);
  const center = useMemo<[number, number]>(() => {
    if (!points.length) return [41.88, -87.65];
    return [points.reduce((s, p) => s + p.lat, 0) / points.length, points.reduce((s, p) => s + p.lon, 0) / points.length];
  }, [points]);
  const showTiles = !!tileUrl && !tilesFailed;

  return (
    <figure className="relative m-0 h-full min-h-80" aria-label={label}>
      <MapContainer
        center={center}
        minZoom={3}
        maxZoom={18}
        zoom={11}
        scrollWheelZoom
        className="h-full min-h-80 w-full rounded-lg"
        style={{ background: '#e8ecf3' }}
      >
        {showTiles && (
          <TileLayer
            url={tileUrl}
            attribution="Map tiles: your configured tile server"
            eventHandlers={{ tileerror: () => setTilesFailed(true) }}
          />
        )}
        <MarkerClusterGroup chunkedLoading iconCreateFunction={clusterIcon}>
          {points.map((p) => (
            <Marker key={p.id} position={[p.lat, p.lon]} icon={markerIcon(p)} title={`${p.title} — ${callStateLabels[p.state]}`}>
              <Popup>
                <strong>{p.title}</strong>
                <br />
                {p.subtitle}
                <br />
                {callStateLabels[p.state]}
                {p.late ? ' · past target' : ''}
                <br />
                <Link to={p.href}>Open the call</Link>
              </Popup>
            </Marker>
          ))}
        </MarkerClusterGroup>
      </MapContainer>
      {!showTiles && (
        <figcaption className="pointer-events-none absolute right-2 bottom-2 left-2 z-[1000] rounded-md bg-white/95 p-2 text-sm text-ink-soft shadow">
          {tilesFailed ? 'Map tiles could not be loaded (offline?).' : 'No map tile server is set.'} Markers are shown on a plain background
          {tileUrl ? '' : '; an owner can set a tile server in Settings'}.
        </figcaption>
      )}
    </figure>
  );
}
