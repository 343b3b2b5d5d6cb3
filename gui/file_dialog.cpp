#include "gui/file_dialog.hpp"

#include <algorithm>
#include <system_error>

#include <imgui.h>
#include <imgui_stdlib.h>

namespace terzo::gui {

namespace {

struct Entry {
    std::string name;
    bool folder;
};

// Folders first, then files with the extension, each sorted by name; hidden entries left out.
// At most 2000 entries are listed so a huge folder cannot stall the window.
std::vector<Entry> list_folder(const std::filesystem::path& folder, const std::string& ext) {
    std::vector<Entry> out;
    std::error_code ec;
    for (std::filesystem::directory_iterator it(folder, ec), end; !ec && it != end; it.increment(ec)) {
        std::string n = it->path().filename().string();
        if (n.empty() || n[0] == '.') continue;
        bool dir = it->is_directory(ec);
        if (!dir && it->path().extension() != ext) continue;
        out.push_back({n, dir});
        if (out.size() >= 2000) break;
    }
    std::sort(out.begin(), out.end(), [](const Entry& a, const Entry& b) {
        return a.folder != b.folder ? a.folder : a.name < b.name;
    });
    return out;
}

const char* title(FileDialog::Purpose p) {
    switch (p) {
    case FileDialog::Purpose::open_tuning: return "Open a tuning (.scl)";
    case FileDialog::Purpose::export_scl: return "Export the tuning as .scl";
    case FileDialog::Purpose::export_lattice_png: return "Export the lattice as PNG";
    case FileDialog::Purpose::save_session_as: return "Save the session as";
    case FileDialog::Purpose::export_sheet_svg: return "Export the tuner's sheet as SVG";
    case FileDialog::Purpose::export_comparison_csv: return "Export the comparison as CSV";
    }
    return "File";
}

} // namespace

void FileDialog::show(Mode m, Purpose p, std::string ext, std::filesystem::path start, std::string file) {
    visible = true;
    mode = m;
    purpose = p;
    extension = std::move(ext);
    std::error_code ec;
    folder = std::filesystem::absolute(start, ec);
    name = std::move(file);
    replace = false;
    message.clear();
}

bool draw_file_dialog(FileDialog& d, std::filesystem::path& chosen) {
    if (!d.visible) return false;
    bool done = false;
    ImGuiIO& io = ImGui::GetIO();
    ImGui::SetNextWindowPos(ImVec2(io.DisplaySize.x * 0.5f, io.DisplaySize.y * 0.5f), ImGuiCond_Appearing, ImVec2(0.5f, 0.5f));
    ImGui::SetNextWindowSize(ImVec2(620, 460), ImGuiCond_Appearing);
    ImGui::OpenPopup(title(d.purpose));
    bool open = true;
    if (ImGui::BeginPopupModal(title(d.purpose), &open)) {
        if (ImGui::Button("Up") && d.folder.has_parent_path()) d.folder = d.folder.parent_path();
        ImGui::SameLine();
        ImGui::TextUnformatted(d.folder.string().c_str());
        ImGui::Separator();
        auto entries = list_folder(d.folder, d.extension);
        ImGui::BeginChild("listing", ImVec2(0, -ImGui::GetFrameHeightWithSpacing() * 3), true);
        for (const Entry& e : entries) {
            std::string label = e.folder ? "[folder] " + e.name : e.name;
            if (ImGui::Selectable(label.c_str(), !e.folder && e.name == d.name, ImGuiSelectableFlags_AllowDoubleClick)) {
                if (e.folder) {
                    d.folder /= e.name;
                } else {
                    d.name = e.name;
                    if (ImGui::IsMouseDoubleClicked(0) && d.mode == FileDialog::Mode::open) {
                        chosen = d.folder / d.name;
                        done = true;
                    }
                }
            }
        }
        if (entries.empty()) ImGui::TextDisabled("(no folders or %s files here)", d.extension.c_str());
        ImGui::EndChild();
        ImGui::SetNextItemWidth(-200);
        if (ImGui::IsWindowAppearing()) ImGui::SetKeyboardFocusHere(); // Enter acts at once
        bool enter = ImGui::InputText("file name", &d.name, ImGuiInputTextFlags_EnterReturnsTrue);
        if (d.mode == FileDialog::Mode::save) {
            ImGui::SameLine();
            ImGui::Checkbox("replace", &d.replace);
        }
        if (!d.message.empty()) ImGui::TextColored(ImVec4(1.0f, 0.45f, 0.4f, 1.0f), "%s", d.message.c_str());
        bool go = ImGui::Button(d.mode == FileDialog::Mode::open ? "Open" : "Save", ImVec2(100, 0)) || enter;
        ImGui::SameLine();
        if (ImGui::Button("Cancel", ImVec2(100, 0)) || ImGui::IsKeyPressed(ImGui::GetKeyIndex(ImGuiKey_Escape))) open = false;
        if (go && !done) {
            if (d.name.empty()) {
                d.message = "type or pick a file name";
            } else {
                std::filesystem::path p = std::filesystem::path(d.name).is_absolute() ? std::filesystem::path(d.name) : d.folder / d.name;
                if (d.mode == FileDialog::Mode::save && p.extension() != d.extension) p += d.extension;
                chosen = p;
                done = true;
            }
        }
        if (done || !open) {
            // The caller shows the dialog again with a message when the chosen path fails.
            ImGui::CloseCurrentPopup();
            d.visible = false;
        }
        ImGui::EndPopup();
    } else {
        d.visible = false;
    }
    if (!open) d.visible = false;
    return done;
}

} // namespace terzo::gui
