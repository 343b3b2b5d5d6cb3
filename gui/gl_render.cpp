#include "gui/gl_render.hpp"

#include <cmath>
#include <cstdio>
#include <cstdlib>
#include <cstdint>

#include <SFML/OpenGL.hpp>
#include <backends/imgui_impl_opengl2.h>
#include <backends/imgui_impl_opengl3.h>
#include <string>

namespace terzo::gui {

namespace {

bool use_gl3 = false; // chosen once by renderer_init, before the first frame
std::string name;

void set_clear_colour(ImU32 c) {
    auto channel = [c](int shift) { return static_cast<float>((c >> shift) & 0xFF) / 255.0f; };
    glClearColor(channel(IM_COL32_R_SHIFT), channel(IM_COL32_G_SHIFT), channel(IM_COL32_B_SHIFT), 1.0f);
}

/// ImGui calls this in draw order with the clip rectangle in effect when it was added; the
/// colour travels in the callback's data pointer.
void clear_clip_rect(const ImDrawList*, const ImDrawCmd* cmd) {
    const ImGuiIO& io = ImGui::GetIO();
    const float sx = io.DisplayFramebufferScale.x, sy = io.DisplayFramebufferScale.y;
    const float height = io.DisplaySize.y * sy;
    const ImVec4 r = cmd->ClipRect; // x1, y1, x2, y2 from the top left
    const auto x = static_cast<GLint>(std::floor(r.x * sx)), y = static_cast<GLint>(std::floor(height - r.w * sy));
    const auto w = static_cast<GLsizei>(std::ceil(r.z * sx)) - x;
    const auto h = static_cast<GLsizei>(std::ceil(height - r.y * sy)) - y;
    if (w <= 0 || h <= 0) return;
    glEnable(GL_SCISSOR_TEST); // the renderer sets its own scissor again for the next command
    glScissor(x, y, w, h);
    set_clear_colour(static_cast<ImU32>(reinterpret_cast<std::uintptr_t>(cmd->UserCallbackData)));
    glClear(GL_COLOR_BUFFER_BIT);
}

} // namespace

void renderer_init() {
    const char* version = reinterpret_cast<const char*>(glGetString(GL_VERSION));
    int major = 0, minor = 0;
    if (version) std::sscanf(version, "%d.%d", &major, &minor);
    // TERZO_OPENGL2=1 chooses the OpenGL 2 renderer anyway (for comparisons, or a driver whose
    // OpenGL 3 misbehaves).
    const char* force2 = std::getenv("TERZO_OPENGL2");
    const bool allow3 = !(force2 && *force2 && std::string(force2) != "0");
    use_gl3 = allow3 && major * 10 + minor >= 32 && ImGui_ImplOpenGL3_Init("#version 130");
    if (use_gl3 && !renderer_has_large_meshes()) { // the backend judged the version otherwise
        ImGui_ImplOpenGL3_Shutdown();
        use_gl3 = false;
    }
    if (!use_gl3) ImGui_ImplOpenGL2_Init();
    name = std::string(use_gl3 ? "OpenGL 3 renderer" : "OpenGL 2 renderer, at most 65535 vertices a pane") + " (OpenGL " +
           (version ? version : "?") + ")";
}

bool renderer_has_large_meshes() {
    return (ImGui::GetIO().BackendFlags & ImGuiBackendFlags_RendererHasVtxOffset) != 0;
}

bool room_for(const ImDrawList* dl, int vertices) {
    // ImGui asserts at 65536 vertices a list without vertex offsets; keep a margin for the
    // text and frames drawn after a view's shapes.
    return use_gl3 || dl->VtxBuffer.Size + vertices < 60000;
}

void renderer_new_frame() {
    if (use_gl3) ImGui_ImplOpenGL3_NewFrame();
    else ImGui_ImplOpenGL2_NewFrame();
}

void renderer_render(ImDrawData* data) {
    if (use_gl3) ImGui_ImplOpenGL3_RenderDrawData(data);
    else ImGui_ImplOpenGL2_RenderDrawData(data);
}

void renderer_shutdown() {
    if (use_gl3) ImGui_ImplOpenGL3_Shutdown();
    else ImGui_ImplOpenGL2_Shutdown();
}

const char* renderer_name() { return name.c_str(); }

void use_unfiltered_font_texture() {
    // The OpenGL 3 renderer creates the font texture with its other objects on its first
    // frame; creating them now lets the filter below stay on the texture it will use.
    if (use_gl3) ImGui_ImplOpenGL3_CreateDeviceObjects();
    else ImGui_ImplOpenGL2_CreateFontsTexture();
    glBindTexture(GL_TEXTURE_2D, static_cast<GLuint>(reinterpret_cast<std::intptr_t>(ImGui::GetIO().Fonts->TexID)));
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MIN_FILTER, GL_NEAREST);
    glTexParameteri(GL_TEXTURE_2D, GL_TEXTURE_MAG_FILTER, GL_NEAREST);
    glBindTexture(GL_TEXTURE_2D, 0);
}

void finish_gl() { glFinish(); }

void clear_window(ImU32 colour) {
    glDisable(GL_SCISSOR_TEST);
    set_clear_colour(colour);
    glClear(GL_COLOR_BUFFER_BIT);
}

void add_clear_fill(ImDrawList* dl, ImU32 colour) {
    dl->AddCallback(clear_clip_rect, reinterpret_cast<void*>(static_cast<std::uintptr_t>(colour)));
}

} // namespace terzo::gui
