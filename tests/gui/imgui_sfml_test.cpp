// The SFML -> ImGui platform layer, driven by synthetic sf::Events with no window: the font
// atlas is built on the CPU and ImGui runs whole frames, so the tests check what a user would
// see (a button that was clicked reports it, typed text reaches a text field).
#include "gui/imgui_sfml.hpp"

#include <catch2/catch.hpp>
#include <imgui.h>

#include <cstring>

using namespace terzo::gui;

namespace {

// One ImGui context for a test, with the platform layer initialised.
struct Context {
    Context() {
        ImGui::CreateContext();
        ImGuiIO& io = ImGui::GetIO();
        io.IniFilename = nullptr;
        platform_init(io, false);
        unsigned char* pixels;
        int w, h;
        io.Fonts->GetTexDataAsRGBA32(&pixels, &w, &h); // builds the atlas on the CPU
    }
    ~Context() {
        platform_shutdown(ImGui::GetIO());
        ImGui::DestroyContext();
    }
};

sf::Event mouse_move(int x, int y) {
    sf::Event e;
    e.type = sf::Event::MouseMoved;
    e.mouseMove = {x, y};
    return e;
}
sf::Event mouse_button(bool down, sf::Mouse::Button b, int x, int y) {
    sf::Event e;
    e.type = down ? sf::Event::MouseButtonPressed : sf::Event::MouseButtonReleased;
    e.mouseButton = {b, x, y};
    return e;
}
sf::Event key(bool down, sf::Keyboard::Key code, bool ctrl = false, bool shift = false) {
    sf::Event e;
    e.type = down ? sf::Event::KeyPressed : sf::Event::KeyReleased;
    e.key = {code, false, ctrl, shift, false};
    return e;
}
sf::Event text(sf::Uint32 c) {
    sf::Event e;
    e.type = sf::Event::TextEntered;
    e.text.unicode = c;
    return e;
}

// Runs one frame with a window holding a button at a fixed place and a text field.
struct Frame {
    bool clicked = false;
};
Frame run_frame(char* buffer, std::size_t size) {
    ImGuiIO& io = ImGui::GetIO();
    platform_new_frame(io, {800, 600}, 1.0f / 60.0f);
    ImGui::NewFrame();
    ImGui::SetNextWindowPos(ImVec2(0, 0));
    ImGui::SetNextWindowSize(ImVec2(400, 300));
    ImGui::Begin("test", nullptr, ImGuiWindowFlags_NoTitleBar | ImGuiWindowFlags_NoMove);
    ImGui::SetCursorScreenPos(ImVec2(20, 20));
    Frame f;
    f.clicked = ImGui::Button("press", ImVec2(100, 40));
    ImGui::SetCursorScreenPos(ImVec2(20, 100));
    ImGui::InputText("field", buffer, size);
    ImGui::End();
    ImGui::Render();
    return f;
}

/// The frame after the events sees Ctrl+S pressed; the frame after that sees Ctrl released.
void check_ctrl_s_then_released(ImGuiIO& io) {
    platform_new_frame(io, {800, 600}, 1.0f / 60.0f);
    ImGui::NewFrame();
    CHECK(io.KeyCtrl);
    CHECK(ImGui::IsKeyPressed(sf::Keyboard::S, false));
    ImGui::Render();
    platform_new_frame(io, {800, 600}, 1.0f / 60.0f);
    ImGui::NewFrame();
    CHECK_FALSE(io.KeyCtrl);
    ImGui::Render();
}

} // namespace

TEST_CASE("mouse events set the position and the buttons", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    platform_event(io, mouse_move(120, 45));
    CHECK(io.MousePos.x == 120.0f);
    CHECK(io.MousePos.y == 45.0f);
    platform_event(io, mouse_button(true, sf::Mouse::Right, 10, 20));
    CHECK(io.MouseDown[1]);
    CHECK(io.MousePos.x == 10.0f);
    platform_new_frame(io, {800, 600}, 0.01f); // a frame passes: the release is immediate
    platform_event(io, mouse_button(false, sf::Mouse::Right, 10, 20));
    CHECK_FALSE(io.MouseDown[1]);
    sf::Event left;
    left.type = sf::Event::MouseLeft;
    platform_event(io, left);
    CHECK(io.MousePos.x < -1e30f);
}

TEST_CASE("wheel events accumulate until the frame reads them", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    sf::Event w;
    w.type = sf::Event::MouseWheelScrolled;
    w.mouseWheelScroll = {sf::Mouse::VerticalWheel, 1.5f, 0, 0};
    platform_event(io, w);
    platform_event(io, w);
    CHECK(io.MouseWheel == 3.0f);
    w.mouseWheelScroll.wheel = sf::Mouse::HorizontalWheel;
    platform_event(io, w);
    CHECK(io.MouseWheelH == 1.5f);
}

TEST_CASE("keys and modifiers reach ImGui, and focus loss releases them", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    platform_event(io, key(true, sf::Keyboard::S, true, false));
    CHECK(io.KeysDown[sf::Keyboard::S]);
    CHECK(io.KeyCtrl);
    CHECK_FALSE(io.KeyShift);
    CHECK(io.KeyMap[ImGuiKey_Escape] == sf::Keyboard::Escape);
    platform_new_frame(io, {800, 600}, 0.01f);
    platform_event(io, key(false, sf::Keyboard::S));
    CHECK_FALSE(io.KeysDown[sf::Keyboard::S]);
    CHECK_FALSE(io.KeyCtrl);
    platform_event(io, key(true, sf::Keyboard::A, false, true));
    sf::Event lost;
    lost.type = sf::Event::LostFocus;
    platform_event(io, lost);
    CHECK_FALSE(io.KeysDown[sf::Keyboard::A]);
    CHECK_FALSE(io.KeyShift);
    // An unknown key (-1) is ignored rather than written out of bounds.
    platform_event(io, key(true, sf::Keyboard::Unknown));
}

TEST_CASE("a press and release over a button clicks it", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    run_frame(buf, sizeof buf);
    platform_event(io, mouse_move(60, 40));
    CHECK_FALSE(run_frame(buf, sizeof buf).clicked);
    platform_event(io, mouse_button(true, sf::Mouse::Left, 60, 40));
    CHECK_FALSE(run_frame(buf, sizeof buf).clicked);
    platform_event(io, mouse_button(false, sf::Mouse::Left, 60, 40));
    CHECK(run_frame(buf, sizeof buf).clicked);
    // A click outside the button does nothing.
    platform_event(io, mouse_button(true, sf::Mouse::Left, 300, 250));
    run_frame(buf, sizeof buf);
    platform_event(io, mouse_button(false, sf::Mouse::Left, 300, 250));
    CHECK_FALSE(run_frame(buf, sizeof buf).clicked);
}

TEST_CASE("a press and release in the same frame still clicks", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    platform_event(io, mouse_move(60, 40));
    run_frame(buf, sizeof buf);
    // A quick tap: both events before one frame. The button is down for that frame ...
    platform_event(io, mouse_button(true, sf::Mouse::Left, 60, 40));
    platform_event(io, mouse_button(false, sf::Mouse::Left, 60, 40));
    CHECK_FALSE(run_frame(buf, sizeof buf).clicked);
    CHECK(io.MouseDown[0]);
    // ... and released in the next, which is when ImGui reports the click.
    CHECK(run_frame(buf, sizeof buf).clicked);
    CHECK_FALSE(io.MouseDown[0]);
    CHECK_FALSE(run_frame(buf, sizeof buf).clicked);
}

TEST_CASE("a key tapped within one frame is seen as pressed once", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    run_frame(buf, sizeof buf);
    platform_event(io, key(true, sf::Keyboard::Num2));
    platform_event(io, key(false, sf::Keyboard::Num2));
    platform_new_frame(io, {800, 600}, 1.0f / 60.0f);
    ImGui::NewFrame();
    CHECK(ImGui::IsKeyPressed(sf::Keyboard::Num2, false));
    ImGui::Render();
    platform_new_frame(io, {800, 600}, 1.0f / 60.0f);
    ImGui::NewFrame();
    CHECK_FALSE(ImGui::IsKeyDown(sf::Keyboard::Num2));
    CHECK_FALSE(ImGui::IsKeyPressed(sf::Keyboard::Num2, false));
    ImGui::Render();
}

TEST_CASE("a Ctrl shortcut tapped within one frame keeps Ctrl for that frame", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    run_frame(buf, sizeof buf);
    // What a test driver sends for ctrl+s: Ctrl down, S down, S up, Ctrl up.
    platform_event(io, key(true, sf::Keyboard::LControl, true));
    platform_event(io, key(true, sf::Keyboard::S, true));
    platform_event(io, key(false, sf::Keyboard::S, true));
    platform_event(io, key(false, sf::Keyboard::LControl, false));
    check_ctrl_s_then_released(io);
}

TEST_CASE("Ctrl released in the frame of the key press still makes a shortcut", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    run_frame(buf, sizeof buf);
    platform_event(io, key(true, sf::Keyboard::LControl, false)); // X reports Ctrl after its own press
    run_frame(buf, sizeof buf);
    // Next frame: S down with Ctrl, Ctrl up, S up (the order a test driver produced).
    platform_event(io, key(true, sf::Keyboard::S, true));
    platform_event(io, key(false, sf::Keyboard::LControl, true));
    platform_event(io, key(false, sf::Keyboard::S, false));
    check_ctrl_s_then_released(io);
}

TEST_CASE("typed text reaches a focused text field, control characters do not", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    char buf[32] = "";
    run_frame(buf, sizeof buf);
    platform_event(io, mouse_button(true, sf::Mouse::Left, 60, 105));
    run_frame(buf, sizeof buf);
    platform_event(io, mouse_button(false, sf::Mouse::Left, 60, 105));
    run_frame(buf, sizeof buf);
    for (sf::Uint32 ch : {U'4', U'1', U'5', U'\b', U'\r'}) platform_event(io, text(ch));
    run_frame(buf, sizeof buf);
    CHECK(std::strcmp(buf, "415") == 0);
    // Backspace arrives as a key: press, frame, release.
    platform_event(io, key(true, sf::Keyboard::Backspace));
    run_frame(buf, sizeof buf);
    platform_event(io, key(false, sf::Keyboard::Backspace));
    run_frame(buf, sizeof buf);
    CHECK(std::strcmp(buf, "41") == 0);
    // Non-ASCII text is kept (UTF-8 in the buffer).
    platform_event(io, text(0x00e9));
    run_frame(buf, sizeof buf);
    CHECK(std::strcmp(buf, "41\xc3\xa9") == 0);
}

TEST_CASE("the new frame sets display size and a positive frame time", "[imgui_sfml]") {
    Context c;
    ImGuiIO& io = ImGui::GetIO();
    platform_new_frame(io, {1280, 800}, 0.0f);
    CHECK(io.DisplaySize.x == 1280.0f);
    CHECK(io.DisplaySize.y == 800.0f);
    CHECK(io.DeltaTime > 0.0f);
    platform_new_frame(io, {1280, 800}, 0.02f);
    CHECK(io.DeltaTime == 0.02f);
}
