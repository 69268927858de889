using System.Globalization;
using System.Text;

namespace Lookup.Cli.Output;

/// <summary>
/// An aligned plain-text table for stdout: columns sized to their widest cell, numbers right-aligned.
/// </summary>
internal sealed class TextTable
{
    private readonly string[] _headers;
    private readonly bool[] _rightAligned;
    private readonly List<string[]> _rows = [];

    public TextTable(params string[] headers)
    {
        _headers = headers;
        _rightAligned = new bool[headers.Length];
    }

    /// <summary>Right-aligns the named columns (numbers read better that way).</summary>
    public TextTable AlignRight(params int[] columns)
    {
        foreach (int c in columns)
        {
            _rightAligned[c] = true;
        }

        return this;
    }

    public void Add(params object?[] cells)
    {
        if (cells.Length != _headers.Length)
        {
            throw new ArgumentException($"row has {cells.Length} cells, the table has {_headers.Length} columns", nameof(cells));
        }

        _rows.Add(Array.ConvertAll(cells, Format));
    }

    public int RowCount => _rows.Count;

    public override string ToString()
    {
        int[] widths = new int[_headers.Length];
        for (int c = 0; c < widths.Length; c++)
        {
            widths[c] = _headers[c].Length;
            foreach (string[] row in _rows)
            {
                widths[c] = Math.Max(widths[c], row[c].Length);
            }
        }

        var text = new StringBuilder();
        AppendRow(text, _headers, widths);
        AppendRow(text, Array.ConvertAll(widths, w => new string('-', w)), widths);
        foreach (string[] row in _rows)
        {
            AppendRow(text, row, widths);
        }

        return text.ToString();
    }

    private void AppendRow(StringBuilder text, string[] cells, int[] widths)
    {
        for (int c = 0; c < cells.Length; c++)
        {
            if (c > 0)
            {
                text.Append("  ");
            }

            bool last = c == cells.Length - 1;
            if (_rightAligned[c])
            {
                text.Append(cells[c].PadLeft(widths[c]));
            }
            else
            {
                text.Append(last ? cells[c] : cells[c].PadRight(widths[c]));
            }
        }

        text.Append('\n');
    }

    private static string Format(object? cell) => cell switch
    {
        null => "",
        float f => f.ToString("0.0000", CultureInfo.InvariantCulture),
        double d => d.ToString("0.0000", CultureInfo.InvariantCulture),
        IFormattable f => f.ToString(null, CultureInfo.InvariantCulture),
        _ => cell.ToString() ?? "",
    };
}
