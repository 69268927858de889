namespace Lookup.Reports;

/// <summary>
/// Makes one text value safe as a CSV cell: neutralised against formula injection, then quoted per RFC 4180.
/// </summary>
internal static class CsvCell
{
    /// <summary>A text cell ready to write: <see cref="Neutralise"/> then <see cref="Quote"/>.</summary>
    public static string Text(string? value) => Quote(Neutralise(value ?? ""));

    /// <summary>
    /// Prefixes a single quote to a value that starts with =, +, -, @, tab or carriage return, so a spreadsheet
    /// shows it as text instead of running it as a formula. This is the mitigation OWASP gives on its
    /// "CSV Injection" page (common practice). Numbers written by us go through
    /// <see cref="CsvTableWriter.Number(long)"/> instead and are not prefixed.
    /// </summary>
    public static string Neutralise(string value)
    {
        ArgumentNullException.ThrowIfNull(value);
        return value.Length > 0 && value[0] is '=' or '+' or '-' or '@' or '\t' or '\r' ? "'" + value : value;
    }

    /// <summary>
    /// Encloses a value in double quotes, doubling any quote inside, when it contains a comma, a quote, a carriage
    /// return or a line feed (RFC 4180, section 2, rules 6 and 7); other values are returned as they are.
    /// </summary>
    public static string Quote(string value)
    {
        ArgumentNullException.ThrowIfNull(value);
        return value.AsSpan().IndexOfAny(",\"\r\n") < 0 ? value : "\"" + value.Replace("\"", "\"\"", StringComparison.Ordinal) + "\"";
    }
}
