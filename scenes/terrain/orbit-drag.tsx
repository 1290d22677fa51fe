import { useThree } from '@react-three/fiber';
import { useEffect, type RefObject } from 'react';
import type { Group } from 'three';

/**
 * Drag turns the model about the vertical and tilts it; the wheel moves the
 * camera nearer or farther. Everything lives in refs and three.js objects and
 * asks for one frame (`invalidate`) — never React state.
 */
export function OrbitDrag({ target, distance }: { target: RefObject<Group | null>; distance: number }) {
  const { gl, camera, invalidate } = useThree();
  useEffect(() => {
    const el = gl.domElement;
    let last: { x: number; y: number } | null = null;
    const down = (e: PointerEvent) => {
      last = { x: e.clientX, y: e.clientY };
      el.setPointerCapture(e.pointerId);
    };
    const move = (e: PointerEvent) => {
      if (!last || !target.current) return;
      target.current.rotation.y += (e.clientX - last.x) * 0.008;
      target.current.rotation.x = Math.min(Math.max(target.current.rotation.x + (e.clientY - last.y) * 0.004, -0.5), 0.6);
      last = { x: e.clientX, y: e.clientY };
      invalidate();
    };
    const up = () => {
      last = null;
    };
    const wheel = (e: WheelEvent) => {
      e.preventDefault();
      const f = Math.pow(1.15, e.deltaY / 100);
      const len = camera.position.length();
      const next = Math.min(Math.max(len * f, distance * 0.3), distance * 3);
      camera.position.multiplyScalar(next / len);
      invalidate();
    };
    el.addEventListener('pointerdown', down);
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerup', up);
    el.addEventListener('wheel', wheel, { passive: false });
    return () => {
      el.removeEventListener('pointerdown', down);
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerup', up);
      el.removeEventListener('wheel', wheel);
    };
  }, [gl, camera, invalidate, target, distance]);
  return null;
}
