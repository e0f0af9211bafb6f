#version 330 core
in vec4 v_color;
in float v_hidden;
out vec4 frag_color;
void main() {
    if (v_hidden > 0.5) discard;
    frag_color = v_color;
}
