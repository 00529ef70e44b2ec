/**
 * The canvas nodes the board draws with. vue-konva's core build plus only the Konva shapes
 * the board uses: the full Konva bundle (every shape and image filter) is about a third of
 * the board's JavaScript. Importing a shape registers its class with Konva, which is where
 * vue-konva's core components look their node classes up. vite.config.ts points the bare
 * `konva` import (which vue-konva makes for a global flag) at Konva's core for the same reason.
 */
import 'konva/lib/shapes/Circle';
import 'konva/lib/shapes/Image';
import 'konva/lib/shapes/Line';
import 'konva/lib/shapes/Rect';
import 'konva/lib/shapes/Text';

export { Stage, Layer, Shape, Line, Circle, Rect, Text, Image } from 'vue-konva/core';
