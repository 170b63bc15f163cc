// Text that is safe in XML 1.0: characters XML 1.0 forbids (most control characters, U+FFFE,
// U+FFFF, surrogates) are removed and bytes that are not UTF-8 become U+FFFD. Escaping of
// `<`, `&` and quotes is left to the XML writer (pugixml). Pure function.
#pragma once

#include <string>
#include <string_view>

namespace treegate::report {

std::string xml_safe(std::string_view text);

}  // namespace treegate::report
