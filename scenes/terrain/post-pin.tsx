/** One post: a mast from its ground to the eye; a cone on top for an existing post, an open octahedron for a proposed one. */
export function PostPin({
  position,
  heightY,
  proposed,
  chosen,
  size,
}: {
  /** The post's foot, scene units. */
  position: [number, number, number];
  /** Mast height, scene units. */
  heightY: number;
  proposed: boolean;
  chosen: boolean;
  /** Marker size, scene units. */
  size: number;
}) {
  const colour = chosen ? '#B8461B' : '#17252B';
  return (
    <group position={position}>
      <mesh position={[0, heightY / 2, 0]}>
        <cylinderGeometry args={[size * 0.12, size * 0.12, heightY, 8]} />
        <meshStandardMaterial color={colour} />
      </mesh>
      {proposed ? (
        <mesh position={[0, heightY + size * 0.6, 0]}>
          <octahedronGeometry args={[size * 0.6]} />
          <meshStandardMaterial color={colour} wireframe />
        </mesh>
      ) : (
        <mesh position={[0, heightY + size * 0.5, 0]}>
          <coneGeometry args={[size * 0.5, size, 12]} />
          <meshStandardMaterial color={colour} />
        </mesh>
      )}
    </group>
  );
}
