#version 330 core
// Coloured line segments (axes, glyphs, cut ring, wireframe).
layout(location = 0) in vec3 a_position;
layout(location = 1) in vec3 a_color;
uniform mat4 u_view;
uniform mat4 u_projection;
uniform vec4 u_tint;   // rgb replaces the vertex colour when tint.a > 0 (wireframe)
uniform vec4 u_cull;   // xyz: the eye; w > 0: hide points on the far side of the surface
out vec4 v_color;
out float v_hidden;    // > 0.5: on the far side (the radial direction faces away from the eye)
void main() {
    v_color = u_tint.a > 0.0 ? u_tint : vec4(a_color, 1.0);
    v_hidden = (u_cull.w > 0.0 && dot(a_position, u_cull.xyz - a_position) < 0.0) ? 1.0 : 0.0;
    gl_Position = u_projection * u_view * vec4(a_position, 1.0);
}
