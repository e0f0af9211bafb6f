#version 330 core
// Soft two-sided lighting: a head light plus a little ambient, so the colour map stays readable.
in vec3 v_normal;
in vec3 v_color;
in vec3 v_view_pos;
uniform float u_alpha;
out vec4 frag_color;
void main() {
    vec3 n = normalize(v_normal);
    vec3 to_eye = normalize(-v_view_pos);
    vec3 light = normalize(vec3(0.35, 0.45, 1.0));
    float diffuse = abs(dot(n, light));
    float rim = pow(1.0 - abs(dot(n, to_eye)), 3.0);
    vec3 h = normalize(light + to_eye);
    float spec = pow(abs(dot(n, h)), 40.0) * 0.12;
    vec3 c = v_color * (0.48 + 0.52 * diffuse) + vec3(spec) - 0.10 * rim * v_color;
    frag_color = vec4(c, u_alpha);
}
