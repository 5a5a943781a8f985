// Prints the role × permission table for DEVELOPERS.md (npm run docs:access-matrix).
import { renderAccessMatrix } from '@/lib/auth/matrix-doc';

console.log(renderAccessMatrix());
