#version 330 core
// Gain surface: position, normal and colour per vertex; lighting is done per fragment in view space.
layout(location = 0) in vec3 a_position;
layout(location = 1) in vec3 a_normal;
layout(location = 2) in vec3 a_color;
uniform mat4 u_view;
uniform mat4 u_projection;
out vec3 v_normal;
out vec3 v_color;
out vec3 v_view_pos;
void main() {
    vec4 p = u_view * vec4(a_position, 1.0);
    v_view_pos = p.xyz;
    v_normal = mat3(u_view) * a_normal;
    v_color = a_color;
    gl_Position = u_projection * p;
}
