using System.Text;

namespace Lookup.Catalogue;

/// <summary>
/// Splits CSV text into records following RFC 4180: comma-separated fields, records ended by CRLF (LF or CR
/// alone are accepted too), fields optionally enclosed in double quotes, a quote inside a quoted field written
/// twice, line breaks allowed inside quoted fields. Blank lines are skipped. A malformed record is returned with
/// its error and reading resumes on the next line, so one bad row does not hide the rest.
/// </summary>
internal sealed class CsvRecordReader
{
    private readonly string _text;
    private readonly StringBuilder _field = new();
    private int _pos;
    private int _line = 1;

    private CsvRecordReader(string text) => _text = text;

    /// <summary>Reads every record of <paramref name="text"/>.</summary>
    public static IReadOnlyList<CsvRecord> Read(string text)
    {
        var reader = new CsvRecordReader(text);
        var records = new List<CsvRecord>();
        while (reader._pos < text.Length)
        {
            if (reader.ReadRecord() is { } record)
            {
                records.Add(record);
            }
        }

        return records;
    }

    private CsvRecord? ReadRecord()
    {
        var startLine = _line;
        if (AtLineEnd())
        {
            SkipLineEnd();
            return null;
        }

        var fields = new List<string>();
        while (true)
        {
            var error = _pos < _text.Length && _text[_pos] == '"' ? ReadQuoted(startLine) : ReadUnquoted(fields.Count + 1);
            fields.Add(_field.ToString());
            if (error is not null)
            {
                SkipRestOfLine();
                return new CsvRecord(startLine, fields, error);
            }

            if (_pos < _text.Length && _text[_pos] == ',')
            {
                _pos++;
                continue;
            }

            SkipLineEnd();
            return new CsvRecord(startLine, fields, null);
        }
    }

    private string? ReadUnquoted(int fieldNumber)
    {
        _field.Clear();
        while (_pos < _text.Length && _text[_pos] != ',' && !AtLineEnd())
        {
            if (_text[_pos] == '"')
            {
                return $"field {fieldNumber} has a quote inside unquoted text; enclose the field in quotes and write the quote twice";
            }

            _field.Append(_text[_pos++]);
        }

        return null;
    }

    private string? ReadQuoted(int startLine)
    {
        _field.Clear();
        var openedOn = _line;
        _pos++;
        while (true)
        {
            if (_pos >= _text.Length)
            {
                return $"a quoted field opened on line {openedOn} is never closed; add the closing quote";
            }

            var c = _text[_pos++];
            if (c == '"')
            {
                if (_pos < _text.Length && _text[_pos] == '"')
                {
                    _field.Append('"');
                    _pos++;
                    continue;
                }

                break;
            }

            if (c == '\n' || (c == '\r' && (_pos >= _text.Length || _text[_pos] != '\n')))
            {
                _line++;
            }

            _field.Append(c);
        }

        if (_pos < _text.Length && _text[_pos] != ',' && !AtLineEnd())
        {
            return $"text follows the closing quote of a field that started on line {startLine}; "
                + "put the whole field inside the quotes";
        }

        return null;
    }

    private bool AtLineEnd() => _pos < _text.Length && (_text[_pos] == '\n' || _text[_pos] == '\r');

    private void SkipLineEnd()
    {
        if (_pos >= _text.Length)
        {
            return;
        }

        if (_text[_pos] == '\r' && _pos + 1 < _text.Length && _text[_pos + 1] == '\n')
        {
            _pos++;
        }

        _pos++;
        _line++;
    }

    private void SkipRestOfLine()
    {
        while (_pos < _text.Length && !AtLineEnd())
        {
            _pos++;
        }

        SkipLineEnd();
    }
}
