#include "core/setting_error.hpp"

#include <utility>

namespace terzo {

namespace {

const std::vector<Setting> all_settings = {Setting::order, Setting::partials, Setting::span, Setting::ref_hz};

// Replaces each "{name}" of a setting in `named` by its wording; other braces stay as they are.
std::string word_settings(const std::string& text, SettingWording wording, const std::vector<Setting>& named) {
    std::string out;
    std::size_t i = 0;
    while (i < text.size()) {
        bool replaced = false;
        if (text[i] == '{') {
            for (Setting s : named) {
                const std::string_view name = setting_name(s);
                const std::size_t close = i + 1 + name.size();
                if (close < text.size() && text[close] == '}' && text.compare(i + 1, name.size(), name) == 0) {
                    out += wording(s);
                    i = close + 1;
                    replaced = true;
                    break;
                }
            }
        }
        if (!replaced) out += text[i++];
    }
    return out;
}

} // namespace

std::string_view setting_name(Setting setting) {
    switch (setting) {
    case Setting::order: return "order";
    case Setting::partials: return "partials";
    case Setting::span: return "span";
    case Setting::ref_hz: return "ref-hz";
    }
    return "setting";
}

std::string option_wording(Setting setting) { return "--" + std::string(setting_name(setting)); }

SettingError::SettingError(Setting setting, std::string text)
    : InputError({option_wording(setting)}, word_settings(text, option_wording, all_settings)),
      about_setting_(true), setting_(setting), named_(all_settings), text_(std::move(text)) {}

SettingError::SettingError(SourcePos pos, std::string text, std::vector<Setting> named)
    : InputError(std::move(pos), word_settings(text, option_wording, named)), named_(std::move(named)),
      text_(std::move(text)) {}

std::string SettingError::worded(SettingWording wording) const {
    SourcePos where = pos();
    if (about_setting_) where.source = wording(setting_);
    return format_error(where, word_settings(text_, wording, named_));
}

void fail(Setting setting, const std::string& text) { throw SettingError(setting, text); }

void fail(const SourcePos& pos, const std::string& text, std::vector<Setting> named) {
    throw SettingError(pos, text, std::move(named));
}

std::string worded(const InputError& e, SettingWording wording) {
    if (const auto* s = dynamic_cast<const SettingError*>(&e)) return s->worded(wording);
    return e.what();
}

} // namespace terzo
