#include "config.h"

#include "cw-group-item.h"

struct _CwGroupItem
{
  GObject parent_instance;

  /* borrowed */
  const CwGroup *group;
  /* owned */
  char *search_text;
};

G_DEFINE_FINAL_TYPE (CwGroupItem, cw_group_item, G_TYPE_OBJECT)

enum
{
  PROP_0,
  PROP_SEARCH_TEXT,
  N_PROPS
};

static GParamSpec *properties[N_PROPS];

static void
cw_group_item_finalize (GObject *object)
{
  CwGroupItem *self = CW_GROUP_ITEM (object);

  g_clear_pointer (&self->search_text, g_free);

  G_OBJECT_CLASS (cw_group_item_parent_class)->finalize (object);
}

static void
cw_group_item_get_property (GObject    *object,
                            guint       prop_id,
                            GValue     *value,
                            GParamSpec *pspec)
{
  CwGroupItem *self = CW_GROUP_ITEM (object);

  switch (prop_id)
    {
    case PROP_SEARCH_TEXT:
      g_value_set_string (value, self->search_text);
      break;
    default:
      G_OBJECT_WARN_INVALID_PROPERTY_ID (object, prop_id, pspec);
    }
}

static void
cw_group_item_class_init (CwGroupItemClass *klass)
{
  GObjectClass *object_class = G_OBJECT_CLASS (klass);

  object_class->finalize = cw_group_item_finalize;
  object_class->get_property = cw_group_item_get_property;

  properties[PROP_SEARCH_TEXT] =
    g_param_spec_string ("search-text", NULL, NULL, NULL,
                         G_PARAM_READABLE | G_PARAM_STATIC_STRINGS | G_PARAM_EXPLICIT_NOTIFY);
  g_object_class_install_properties (object_class, N_PROPS, properties);
}

static void
cw_group_item_init (CwGroupItem *self)
{
}

CwGroupItem *
cw_group_item_new (const CwGroup *group)
{
  CwGroupItem *self;

  g_return_val_if_fail (group != NULL, NULL);

  self = g_object_new (CW_TYPE_GROUP_ITEM, NULL);
  self->group = group;
  /* Searched by id, label and formula, so "me", "Me" and "CH3" all find methyl. */
  self->search_text = g_strjoin (" ", group->id ? group->id : "", group->label ? group->label : "",
                                 group->formula ? group->formula : "", NULL);
  return self;
}

const CwGroup *
cw_group_item_get_group (CwGroupItem *self)
{
  g_return_val_if_fail (CW_IS_GROUP_ITEM (self), NULL);
  return self->group;
}

const char *
cw_group_item_get_search_text (CwGroupItem *self)
{
  g_return_val_if_fail (CW_IS_GROUP_ITEM (self), NULL);
  return self->search_text;
}
