namespace Lookup.Imaging;

/// <summary>The order of the three colour planes a network expects.</summary>
public enum ChannelOrder
{
    /// <summary>Red, green, blue.</summary>
    Rgb,

    /// <summary>Blue, green, red (networks trained with OpenCV or Caffe loaders).</summary>
    Bgr,
}
