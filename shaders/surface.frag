#version 330 core
// Soft two-sided lighting: a head light plus a little ambient, so the colour map stays readable.
in vec3 v_normal;
in vec3 v_color;
in vec3 v_view_pos;
uniform float u_alpha;
uniform float u_hatch;  // > 0: the "not measured" region, hatched every u_hatch pixels (no data there)
out vec4 frag_color;
void main() {
    vec3 n = normalize(v_normal);
    vec3 to_eye = normalize(-v_view_pos);
    vec3 light = normalize(vec3(0.35, 0.45, 1.0));
    float diffuse = abs(dot(n, light));
    float facing = abs(dot(n, to_eye));
    float rim = (1.0 - facing) * (1.0 - facing);
    vec3 h = normalize(light + to_eye);
    float s = abs(dot(n, h));
    s = s * s; s = s * s; s = s * s; s = s * s; s = s * s;   // ^32, cheaper than pow on llvmpipe
    vec3 c = v_color * (0.50 + 0.50 * diffuse) + vec3(0.08 * s) - 0.12 * rim * v_color;
    if (u_hatch > 0.0) {  // nearly flat shading, so it reads as a marking, not as a shape of the data
        c = v_color * (0.86 + 0.14 * diffuse);
        if (mod(gl_FragCoord.x + gl_FragCoord.y, u_hatch) < 0.18 * u_hatch) c *= 0.82;
    }
    frag_color = vec4(c, u_alpha);
}
