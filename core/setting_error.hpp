// Errors about a setting (order, span ...): core names the setting neutrally and each front
// end words it its own way, the CLI as an option ("--order"), the window as its label
// ("order |a|+|b|"). A SettingError is an InputError, so every catch of InputError still
// takes it; what() is the command-line wording, the form a message kept as text (a skipped
// file's reason) has always had.
#pragma once

#include <string>
#include <string_view>
#include <vector>

#include "core/error.hpp"

namespace terzo {

/// A setting that core checks and names in its messages.
enum class Setting { order, partials, span, ref_hz };

/// The neutral name of a setting: "order", "partials", "span", "ref-hz".
std::string_view setting_name(Setting setting);

/// How a front end words a setting in a message.
using SettingWording = std::string (*)(Setting setting);

/// The command-line wording: "--" and the neutral name ("--ref-hz").
std::string option_wording(Setting setting);

/// An InputError whose text names settings as "{order}", "{span}" ... (neutral names in
/// braces), and whose source may be a setting too.
class SettingError : public InputError {
public:
    /// About `setting` itself (the source of the message).
    SettingError(Setting setting, std::string text);
    /// About an input (a file) whose text names the settings in `named`.
    SettingError(SourcePos pos, std::string text, std::vector<Setting> named);
    /// The whole message with every setting worded by `wording` (what() uses option_wording).
    std::string worded(SettingWording wording) const;

private:
    bool about_setting_ = false;
    Setting setting_ = Setting::order;
    std::vector<Setting> named_;
    std::string text_;
};

/// Throws SettingError about a setting; `text` names settings as "{order}" ...
[[noreturn]] void fail(Setting setting, const std::string& text);
/// Throws SettingError about an input; `text` names the settings in `named` as "{order}" ...
[[noreturn]] void fail(const SourcePos& pos, const std::string& text, std::vector<Setting> named);

/// e.what(), or for a SettingError its message worded by `wording`.
std::string worded(const InputError& e, SettingWording wording);

} // namespace terzo
