using System.Text;

namespace Lookup.Reports;

/// <summary>
/// Makes untrusted text (file names, SKUs, folder names) safe to place in an HTML page.
/// </summary>
internal static class HtmlText
{
    /// <summary>
    /// Escapes text for element content and for attribute values in single or double quotes: &amp; &lt; &gt; " '
    /// become character references. Control characters that HTML forbids and unpaired surrogates become U+FFFD,
    /// so a crafted file name cannot break the page. Other characters, including non-ASCII, are kept as they are
    /// (reports are written as UTF-8).
    /// </summary>
    public static string Escape(string? text)
    {
        if (string.IsNullOrEmpty(text))
        {
            return "";
        }

        var builder = new StringBuilder(text.Length + 16);
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (char.IsHighSurrogate(c) && i + 1 < text.Length && char.IsLowSurrogate(text[i + 1]))
            {
                builder.Append(c).Append(text[++i]);
                continue;
            }

            builder.Append(c switch
            {
                '&' => "&amp;",
                '<' => "&lt;",
                '>' => "&gt;",
                '"' => "&quot;",
                '\'' => "&#39;",
                _ when IsForbidden(c) => "\uFFFD",
                _ => c.ToString(),
            });
        }

        return builder.ToString();
    }

    /// <summary>
    /// Turns a relative path ('/' separators) into the value of an href or src attribute: every segment is
    /// percent-encoded (RFC 3986), so a name like "javascript:x" can only ever be a relative link to a file.
    /// </summary>
    public static string UrlPath(string relativePath)
    {
        ArgumentNullException.ThrowIfNull(relativePath);
        return string.Join('/', relativePath.Split('/').Select(Uri.EscapeDataString));
    }

    // HTML forbids the C0 controls other than tab, line feed, form feed and carriage return, DEL, the C1 controls,
    // and lone surrogates in a document (WHATWG HTML, "13.2.2 Parse errors", from memory).
    private static bool IsForbidden(char c) =>
        (c < ' ' && c is not ('\t' or '\n' or '\f' or '\r')) || (c >= '\u007F' && c <= '\u009F') || char.IsSurrogate(c);
}
