/** A vertical pole: the observer's eye or the target, with an optional hidden lower part. */
export function PostMarker({
  x,
  baseY,
  heightY,
  hiddenY = 0,
  color,
  radius = 0.12,
}: {
  x: number;
  baseY: number;
  heightY: number;
  hiddenY?: number;
  color: string;
  radius?: number;
}) {
  const shown = Math.max(heightY - hiddenY, 0);
  const hidden = Math.min(hiddenY, heightY);
  return (
    <group position={[x, baseY, 0]}>
      {hidden > 0 ? (
        <mesh position={[0, hidden / 2, 0]}>
          <cylinderGeometry args={[radius, radius, hidden, 12]} />
          <meshStandardMaterial color="#7A8A91" transparent opacity={0.6} />
        </mesh>
      ) : null}
      {shown > 0 ? (
        <mesh position={[0, hidden + shown / 2, 0]}>
          <cylinderGeometry args={[radius, radius, shown, 12]} />
          <meshStandardMaterial color={color} />
        </mesh>
      ) : null}
    </group>
  );
}
