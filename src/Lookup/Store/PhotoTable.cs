using LiteDB;

namespace Lookup.Store;

/// <summary>
/// The photo records of an index file, keyed by relative path, with indexes on node id, SKU and SHA-256.
/// Writes join the caller's transaction (<see cref="IndexFile.InTransaction"/>), so a batch of photo records
/// commits together with the graph nodes it refers to.
/// Thread safety: reads from any thread; writes on the writer's thread only.
/// </summary>
public sealed class PhotoTable
{
    internal const string CollectionName = "photos";

    private readonly IndexFile _file;
    private readonly ILiteCollection<BsonDocument> _photos;

    /// <summary>The photo table of <paramref name="file"/>.</summary>
    public PhotoTable(IndexFile file)
    {
        ArgumentNullException.ThrowIfNull(file);
        _file = file;
        _photos = file.Database.GetCollection(CollectionName);
        if (file.IsWritable)
        {
            _photos.EnsureIndex("node");
            _photos.EnsureIndex("sku");
            _photos.EnsureIndex("sha");
        }
    }

    /// <summary>Number of records (indexed and failed).</summary>
    public int Count => _photos.Count();

    /// <summary>Every record, in key order.</summary>
    public IEnumerable<PhotoRecord> All() => _photos.FindAll().Select(FromBson);

    /// <summary>The record for <paramref name="path"/>, or null.</summary>
    public PhotoRecord? Find(string path) => _photos.FindById(path) is { } doc ? FromBson(doc) : null;

    /// <summary>The indexed photo whose embedding is graph node <paramref name="nodeId"/>, or null.</summary>
    public PhotoRecord? FindByNode(int nodeId) =>
        _photos.FindOne(Query.EQ("node", nodeId)) is { } doc ? FromBson(doc) : null;

    /// <summary>Every record filed under <paramref name="sku"/>.</summary>
    public IEnumerable<PhotoRecord> FindBySku(string sku) => _photos.Find(Query.EQ("sku", sku)).Select(FromBson);

    /// <summary>Every record whose bytes hash to <paramref name="sha256"/>.</summary>
    public IEnumerable<PhotoRecord> FindBySha256(string sha256) => _photos.Find(Query.EQ("sha", sha256)).Select(FromBson);

    /// <summary>Writes <paramref name="record"/>, replacing any record with the same path.</summary>
    public void Upsert(PhotoRecord record)
    {
        ArgumentNullException.ThrowIfNull(record);
        _file.RequireWritable();
        _photos.Upsert(ToBson(record));
    }

    /// <summary>Removes the record for <paramref name="path"/>; returns whether there was one.</summary>
    public bool Delete(string path)
    {
        _file.RequireWritable();
        return _photos.Delete(path);
    }

    internal static BsonDocument ToBson(PhotoRecord r)
    {
        var doc = new BsonDocument
        {
            ["_id"] = r.Path,
            ["sku"] = r.Sku is null ? BsonValue.Null : r.Sku,
            ["size"] = r.Size,
            ["mtime"] = r.MtimeUtcTicks,
            ["sha"] = r.Sha256 is null ? BsonValue.Null : r.Sha256,
            ["status"] = r.Status.ToString(),
            ["node"] = r.NodeId is int node ? node : BsonValue.Null,
            ["w"] = r.Width,
            ["h"] = r.Height,
            ["fmt"] = r.Format is null ? BsonValue.Null : r.Format,
            ["dhash"] = unchecked((long)r.DHash),
            ["updated"] = r.UpdatedUtc,
        };
        if (r.Thumbnail is not null)
        {
            doc["thumb"] = r.Thumbnail;
        }

        if (r.Detail is not null)
        {
            doc["detail"] = r.Detail;
        }

        if (r.Chroma is not null)
        {
            doc["chroma"] = r.Chroma;
        }

        if (r.FailureReason is not null)
        {
            doc["why"] = r.FailureReason;
            doc["msg"] = r.FailureMessage ?? "";
        }

        return doc;
    }

    internal static PhotoRecord FromBson(BsonDocument doc) => new()
    {
        Path = doc["_id"].AsString,
        Sku = doc["sku"].IsNull ? null : doc["sku"].AsString,
        Size = doc["size"].AsInt64,
        MtimeUtcTicks = doc["mtime"].AsInt64,
        Sha256 = doc["sha"].IsNull ? null : doc["sha"].AsString,
        Status = Enum.Parse<PhotoStatus>(doc["status"].AsString),
        NodeId = doc["node"].IsNull ? null : doc["node"].AsInt32,
        Width = doc["w"].AsInt32,
        Height = doc["h"].AsInt32,
        Format = doc["fmt"].IsNull ? null : doc["fmt"].AsString,
        DHash = unchecked((ulong)doc["dhash"].AsInt64),
        Thumbnail = doc.TryGetValue("thumb", out var thumb) ? thumb.AsBinary : null,
        Detail = doc.TryGetValue("detail", out var detail) ? detail.AsBinary : null,
        Chroma = doc.TryGetValue("chroma", out var chroma) ? chroma.AsBinary : null,
        FailureReason = doc.TryGetValue("why", out var why) ? why.AsString : null,
        FailureMessage = doc.TryGetValue("msg", out var msg) ? msg.AsString : null,
        UpdatedUtc = doc["updated"].AsDateTime.ToUniversalTime(),
    };
}
