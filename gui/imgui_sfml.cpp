#include "gui/imgui_sfml.hpp"

#include <cfloat>
#include <string>

#include <SFML/Window/Clipboard.hpp>
#include <SFML/Window/Keyboard.hpp>
#include <imgui.h>

namespace terzo::gui {

namespace {

// Per-context state, kept in io.BackendPlatformUserData. For each button and key: pressed
// since the last new frame, and a release waiting to be applied at the next new frame.
struct PlatformData {
    bool mouse_fresh[5] = {};
    bool mouse_release[5] = {};
    bool mouse_release_next[5] = {};
    bool key_fresh[512] = {};
    bool key_release[512] = {};
    bool key_release_next[512] = {};
    sf::Event::KeyEvent last_key{}; // modifiers as the last key event reported them
    sf::Event::KeyEvent pressed_with{}; // modifiers held by any key press since the last frame
};

PlatformData& data(ImGuiIO& io) {
    IM_ASSERT(io.BackendPlatformUserData && "platform_init was not called");
    return *static_cast<PlatformData*>(io.BackendPlatformUserData);
}

// Press: down at once. Release: at once, unless the press came in this same frame; then at
// the next new frame, so that ImGui sees the button down for one frame.
void press(bool& down, bool& fresh, bool& release_next) {
    down = true;
    fresh = true;
    release_next = false;
}
void release(bool& down, bool fresh, bool& release) {
    if (fresh) release = true;
    else down = false;
}

// ImGui keeps the pointer it is given; the string lives until the next call.
const char* get_clipboard(void*) {
    static std::string text;
    text = sf::Clipboard::getString().toAnsiString();
    return text.c_str();
}

void set_clipboard(void*, const char* text) { sf::Clipboard::setString(sf::String::fromUtf8(text, text + std::char_traits<char>::length(text))); }

int mouse_index(sf::Mouse::Button b) {
    switch (b) {
    case sf::Mouse::Left: return 0;
    case sf::Mouse::Right: return 1;
    case sf::Mouse::Middle: return 2;
    case sf::Mouse::XButton1: return 3;
    case sf::Mouse::XButton2: return 4;
    default: return -1;
    }
}

void set_modifiers(ImGuiIO& io, const sf::Event::KeyEvent& k) {
    io.KeyCtrl = k.control;
    io.KeyShift = k.shift;
    io.KeyAlt = k.alt;
    io.KeySuper = k.system;
}

} // namespace

void platform_init(ImGuiIO& io, bool with_clipboard) {
    io.BackendPlatformName = "terzo_sfml";
    io.BackendPlatformUserData = new PlatformData;
    io.KeyMap[ImGuiKey_Tab] = sf::Keyboard::Tab;
    io.KeyMap[ImGuiKey_LeftArrow] = sf::Keyboard::Left;
    io.KeyMap[ImGuiKey_RightArrow] = sf::Keyboard::Right;
    io.KeyMap[ImGuiKey_UpArrow] = sf::Keyboard::Up;
    io.KeyMap[ImGuiKey_DownArrow] = sf::Keyboard::Down;
    io.KeyMap[ImGuiKey_PageUp] = sf::Keyboard::PageUp;
    io.KeyMap[ImGuiKey_PageDown] = sf::Keyboard::PageDown;
    io.KeyMap[ImGuiKey_Home] = sf::Keyboard::Home;
    io.KeyMap[ImGuiKey_End] = sf::Keyboard::End;
    io.KeyMap[ImGuiKey_Insert] = sf::Keyboard::Insert;
    io.KeyMap[ImGuiKey_Delete] = sf::Keyboard::Delete;
    io.KeyMap[ImGuiKey_Backspace] = sf::Keyboard::Backspace;
    io.KeyMap[ImGuiKey_Space] = sf::Keyboard::Space;
    io.KeyMap[ImGuiKey_Enter] = sf::Keyboard::Enter;
    io.KeyMap[ImGuiKey_Escape] = sf::Keyboard::Escape;
    io.KeyMap[ImGuiKey_KeyPadEnter] = sf::Keyboard::Enter; // SFML 2.5 has no separate key
    io.KeyMap[ImGuiKey_A] = sf::Keyboard::A;
    io.KeyMap[ImGuiKey_C] = sf::Keyboard::C;
    io.KeyMap[ImGuiKey_V] = sf::Keyboard::V;
    io.KeyMap[ImGuiKey_X] = sf::Keyboard::X;
    io.KeyMap[ImGuiKey_Y] = sf::Keyboard::Y;
    io.KeyMap[ImGuiKey_Z] = sf::Keyboard::Z;
    if (with_clipboard) {
        io.GetClipboardTextFn = get_clipboard;
        io.SetClipboardTextFn = set_clipboard;
    }
}

void platform_shutdown(ImGuiIO& io) {
    delete static_cast<PlatformData*>(io.BackendPlatformUserData);
    io.BackendPlatformUserData = nullptr;
}

void platform_event(ImGuiIO& io, const sf::Event& event) {
    PlatformData& d = data(io);
    switch (event.type) {
    case sf::Event::MouseMoved:
        io.MousePos = ImVec2(static_cast<float>(event.mouseMove.x), static_cast<float>(event.mouseMove.y));
        break;
    case sf::Event::MouseLeft:
        io.MousePos = ImVec2(-FLT_MAX, -FLT_MAX);
        break;
    case sf::Event::MouseButtonPressed:
    case sf::Event::MouseButtonReleased: {
        int i = mouse_index(event.mouseButton.button);
        io.MousePos = ImVec2(static_cast<float>(event.mouseButton.x), static_cast<float>(event.mouseButton.y));
        if (i >= 0) {
            if (event.type == sf::Event::MouseButtonPressed) press(io.MouseDown[i], d.mouse_fresh[i], d.mouse_release_next[i]);
            else release(io.MouseDown[i], d.mouse_fresh[i], d.mouse_release[i]);
        }
        break;
    }
    case sf::Event::MouseWheelScrolled:
        if (event.mouseWheelScroll.wheel == sf::Mouse::VerticalWheel) io.MouseWheel += event.mouseWheelScroll.delta;
        else io.MouseWheelH += event.mouseWheelScroll.delta;
        break;
    case sf::Event::KeyPressed:
    case sf::Event::KeyReleased: {
        int code = event.key.code;
        if (code >= 0 && code < static_cast<int>(IM_ARRAYSIZE(io.KeysDown))) {
            if (event.type == sf::Event::KeyPressed) press(io.KeysDown[code], d.key_fresh[code], d.key_release_next[code]);
            else release(io.KeysDown[code], d.key_fresh[code], d.key_release[code]);
        }
        set_modifiers(io, event.key);
        d.last_key = event.key;
        if (event.type == sf::Event::KeyPressed) {
            d.pressed_with.control |= event.key.control;
            d.pressed_with.shift |= event.key.shift;
            d.pressed_with.alt |= event.key.alt;
            d.pressed_with.system |= event.key.system;
        }
        break;
    }
    case sf::Event::TextEntered:
        // Control characters (backspace, enter, tab, delete) arrive as keys, not text.
        if (event.text.unicode >= 0x20 && event.text.unicode != 0x7f)
            io.AddInputCharacter(event.text.unicode);
        break;
    case sf::Event::LostFocus:
        // Keys released while another window has the focus never reach us: forget them all.
        for (bool& k : io.KeysDown) k = false;
        for (bool& b : io.MouseDown) b = false;
        d = PlatformData{};
        io.KeyCtrl = io.KeyShift = io.KeyAlt = io.KeySuper = false;
        break;
    default:
        break;
    }
}

void platform_new_frame(ImGuiIO& io, sf::Vector2u display_size, float seconds) {
    PlatformData& d = data(io);
    // Releases deferred in the previous frame happen now; this frame's wait for the next.
    for (int i = 0; i < 5; ++i) {
        if (d.mouse_release_next[i]) io.MouseDown[i] = false;
        d.mouse_release_next[i] = d.mouse_release[i];
        d.mouse_release[i] = d.mouse_fresh[i] = false;
    }
    for (int k = 0; k < 512; ++k) {
        if (d.key_release_next[k]) io.KeysDown[k] = false;
        d.key_release_next[k] = d.key_release[k];
        d.key_release[k] = d.key_fresh[k] = false;
    }
    // A shortcut tapped quickly (Ctrl down, S down, Ctrl up, S up) may have reported "no Ctrl"
    // by now. Ctrl counts in this frame when the modifier key is still (deferred) down, when
    // the last key event says so, or when any key was pressed with it since the last frame.
    auto down = [&](sf::Keyboard::Key k) { return io.KeysDown[k]; };
    const sf::Event::KeyEvent& l = d.last_key;
    const sf::Event::KeyEvent& p = d.pressed_with;
    io.KeyCtrl = l.control || p.control || down(sf::Keyboard::LControl) || down(sf::Keyboard::RControl);
    io.KeyShift = l.shift || p.shift || down(sf::Keyboard::LShift) || down(sf::Keyboard::RShift);
    io.KeyAlt = l.alt || p.alt || down(sf::Keyboard::LAlt) || down(sf::Keyboard::RAlt);
    io.KeySuper = l.system || p.system || down(sf::Keyboard::LSystem) || down(sf::Keyboard::RSystem);
    d.pressed_with = {};
    io.DisplaySize = ImVec2(static_cast<float>(display_size.x), static_cast<float>(display_size.y));
    io.DisplayFramebufferScale = ImVec2(1.0f, 1.0f);
    io.DeltaTime = seconds > 0.0f ? seconds : 1.0f / 60.0f; // ImGui asserts DeltaTime > 0
}

} // namespace terzo::gui
