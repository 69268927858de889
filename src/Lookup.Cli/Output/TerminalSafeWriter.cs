using System.Text;

namespace Lookup.Cli.Output;

/// <summary>
/// Writes through to a terminal with the characters that start terminal control sequences replaced by U+FFFD: ESC,
/// the other C0 controls except tab, line feed and carriage return, DEL, and the C1 controls (U+0080–U+009F, CSI
/// among them; ECMA-48 sections 5.2–5.3). File and folder names are printed as they are found, and a name holding
/// an escape sequence could otherwise retitle the window, move the cursor or write to the clipboard. Used only when
/// the stream is a terminal: redirected output (CSV, JSON, files, pipes) stays byte for byte.
/// </summary>
internal sealed class TerminalSafeWriter(TextWriter inner) : TextWriter
{
    public override Encoding Encoding => inner.Encoding;

    public override IFormatProvider FormatProvider => inner.FormatProvider;

    public override string NewLine
    {
#pragma warning disable CS8765 // the base property allows null on set
        get => inner.NewLine;
        set => inner.NewLine = value;
#pragma warning restore CS8765
    }

    /// <summary>The text with every control-sequence character replaced.</summary>
    public static string Clean(string text)
    {
        if (!text.AsSpan().ContainsAny(Unsafe))
        {
            return text;
        }

        var builder = new StringBuilder(text.Length);
        foreach (var c in text)
        {
            builder.Append(IsUnsafe(c) ? '\uFFFD' : c);
        }

        return builder.ToString();
    }

    public override void Write(char value) => inner.Write(IsUnsafe(value) ? '\uFFFD' : value);

    public override void Write(string? value)
    {
        if (value is not null)
        {
            inner.Write(Clean(value));
        }
    }

    public override void Write(char[] buffer, int index, int count) => Write(new string(buffer, index, count));

    public override void WriteLine(string? value)
    {
        Write(value);
        inner.WriteLine();
    }

    public override void Flush() => inner.Flush();

    private static readonly System.Buffers.SearchValues<char> Unsafe = System.Buffers.SearchValues.Create(
        [.. Enumerable.Range(0, 0x20).Where(c => c is not ('\t' or '\n' or '\r')).Select(c => (char)c), .. Enumerable.Range(0x7F, 0x21).Select(c => (char)c)]);

    private static bool IsUnsafe(char c) => Unsafe.Contains(c);
}
