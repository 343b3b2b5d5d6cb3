// A small file chooser drawn with ImGui: a folder listing (folders first, then files with the
// wanted extension), a path field, and Open or Save. It only picks a path; the caller acts on it.
#pragma once

#include <filesystem>
#include <string>
#include <vector>

namespace terzo::gui {

struct FileDialog {
    enum class Mode { open, save };
    enum class Purpose { open_tuning, export_scl, export_lattice_png, save_session_as, export_sheet_svg, export_comparison_csv };

    bool visible = false;
    Mode mode = Mode::open;
    Purpose purpose = Purpose::open_tuning;
    std::string extension;           ///< ".scl", ".png", ".json"
    std::filesystem::path folder;    ///< the folder being listed
    std::string name;                ///< the file name field
    bool replace = false;            ///< save mode: replace an existing file
    std::string message;             ///< why the last attempt failed

    /// Shows the dialog for a purpose, starting in folder.
    void show(Mode m, Purpose p, std::string ext, std::filesystem::path start, std::string file = {});
};

/// Draws the dialog when visible; returns true (once) when the user chose a path, then
/// `chosen` holds it.
bool draw_file_dialog(FileDialog& d, std::filesystem::path& chosen);

} // namespace terzo::gui
