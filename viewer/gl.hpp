// OpenGL 3.3 core declarations for the viewer's own GL code (the GLVND libGL exports every entry
// point, and its dispatch serves both GLX and EGL contexts). Include this, never <GL/gl.h>.
#pragma once
#ifndef GL_GLEXT_PROTOTYPES
#define GL_GLEXT_PROTOTYPES 1
#endif
#include <GL/glcorearb.h>
